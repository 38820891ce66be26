// Expo's preset for the app and for jest (jest-expo and the node test projects both go through babel-jest).
module.exports = function (api) {
  api.cache(true);
  return { presets: ['babel-preset-expo'] };
};

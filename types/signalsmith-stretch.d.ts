// signalsmith-stretch ships no types. Its one export, a Web Audio node factory, is not used: the package is loaded
// for what it registers in a worklet scope (audio/playback/signalsmith.ts).
declare module 'signalsmith-stretch' {
  const createStretchNode: unknown;
  export default createStretchNode;
}

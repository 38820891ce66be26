module.exports = async function globalTeardown() {
  for (const child of globalThis.__tactusChildren ?? []) child.kill('SIGTERM');
};

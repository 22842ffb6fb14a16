// Imported first by components.setup.ts, so it runs before any module can read it:
// react-native-worklets (and reanimated through it) pick their JavaScript implementation instead of the
// native one when they see a Jest worker id. The testing library's own afterEach cleanup is switched
// off because components.setup.ts registers it per test file (see there).
process.env.JEST_WORKER_ID ??= '1';
process.env.RNTL_SKIP_AUTO_CLEANUP = 'true';

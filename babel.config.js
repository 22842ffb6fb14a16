// Expo's preset covers TypeScript, JSX, Flow in React Native and the reanimated/worklets plugin.
module.exports = function (api) {
  api.cache(true);
  return { presets: ['babel-preset-expo'] };
};

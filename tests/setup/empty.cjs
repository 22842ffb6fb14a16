// On the web react-native-reanimated and react-native-worklets resolve to this empty module (as metro.config.js
// resolves them for the web build).
module.exports = {};

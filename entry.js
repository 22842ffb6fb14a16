// The app's entry on phones: Expo Router's own. (The web's is entry.web.js, which starts the same in steps.)
require('expo-router/entry');

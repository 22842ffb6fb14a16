// The root of the gesture system. On phones (iOS, Android) gesture handler needs its root view at the top of
// the app; on the web it needs none, so the web build (GestureRoot.web.tsx) loads gesture handler only with the
// screens that have a plan.
export { GestureHandlerRootView as GestureRoot } from 'react-native-gesture-handler';

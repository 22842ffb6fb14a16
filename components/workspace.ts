// Every screen that draws a plan but the read-only link's, in one module the routes load on demand
// (components/workspaceScreen.tsx). On the web each route is a chunk of its own, and the bundler puts any module
// two route chunks share into a common chunk every page downloads first; reaching these screens only through
// this one module keeps the editor, classes, crew sheets, photos and their libraries in one chunk that the
// sign-in page and the library never fetch. It always loads after components/shareScreen.ts, whose chunk holds
// what the two share (the plan, the meter, the document model, gesture handler, culori, d3: scripts/chunkTiers.cjs).
export { EditorScreen } from './editor/EditorScreen';
export { AssignmentScreen } from './classes/AssignmentScreen';
export { ClassScreen } from './classes/ClassScreen';
export { ClassesScreen } from './classes/ClassesScreen';
export { LessonBuilder } from './classes/LessonBuilder';
export { LessonScreen } from './classes/LessonScreen';
export { Presentation } from './classes/Presentation';
export { ReviewScreen } from './classes/ReviewScreen';

// The read-only link's screen and the setup document's parser: a chunk of its own, loaded before
// components/workspace.ts whenever that loads (components/workspaceScreen.tsx, hooks/setups.ts). The plan,
// the meter and the document model live here, so the share page gets them without the editor, classes or crew
// sheets; the build keeps what both need in this chunk rather than in the one every page downloads
// (scripts/chunkTiers.cjs).
export { SharedSetupScreen } from './crew/SharedSetupScreen';
export { parseDocument } from '../model/document';

// What each role may do. Routes ask these, never compare role names themselves.
import type { StudioRole } from '../model/api';

export const studioCan = {
  read: (r: StudioRole | null) => r !== null,
  comment: (r: StudioRole | null) => r !== null,
  write: (r: StudioRole | null) => r === 'owner' || r === 'editor',
  manageMembers: (r: StudioRole | null) => r === 'owner',
};

// Demo accounts, a demo studio and class, printed by `npm start`. All names are invented.
export const DEMO_PASSWORD = 'falloff-demo-1';

export const demoUsers = {
  owner: { name: 'Ines Marlowe', email: 'ines@harbourlight.test', studioRole: 'owner' },
  editor: { name: 'Tomas Revel', email: 'tomas@harbourlight.test', studioRole: 'editor' },
  crew: { name: 'Kit Abara', email: 'kit@harbourlight.test', studioRole: 'crew' },
  instructor: { name: 'Dana Whitcombe', email: 'dana@harbourlight.test', studioRole: null },
  student: { name: 'Sami Lund', email: 'sami@harbourlight.test', studioRole: null },
} as const;
export type DemoUserKey = keyof typeof demoUsers;

export const DEMO_STUDIO = 'Harbour Light Studio';
export const DEMO_CLASS = 'Light One: portraits with flash';
export const DEMO_JOIN_CODE = 'LIGHT1';

import type { PhotoFile } from '../../hooks/photos';

/** What both pickers (PhotoPicker.tsx, PhotoPicker.web.tsx) take. */
export type PhotoPickerProps = { onPick: (file: PhotoFile) => void; busy: boolean; label: string };
export const ACCEPT = 'image/jpeg,image/png,image/webp,image/heic,image/heif,.heic,.heif';

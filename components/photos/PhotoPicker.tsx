// Choosing a photo to attach. This is the phone app's version: no file picker module is installed, so it
// says where to attach photos from; the web sibling (PhotoPicker.web.tsx) is a real file input.
import { Body } from '../ui';
import type { PhotoPickerProps } from './pickerTypes';

export function PhotoPicker(_props: PhotoPickerProps) {
  return <Body dim>Attach photos from Falloff in a browser; the phone app shows the ones attached.</Body>;
}

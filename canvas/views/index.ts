// Kind → view: the one place the canvas learns how to draw each kind of item.
import type { ComponentType } from 'react';
import type { ItemKind, ItemOf } from '../../model/document';
import { ArrowView, CameraView, LightView, NoteView, PanelView, PropView, SubjectView, TapeView, WallView, type ViewProps } from './glyphs';

export const itemViews: { [K in ItemKind]: ComponentType<ViewProps<ItemOf<K>>> } = {
  wall: WallView,
  subject: SubjectView,
  prop: PropView,
  camera: CameraView,
  light: LightView,
  reflector: PanelView,
  flag: PanelView,
  vflat: PanelView,
  scrim: PanelView,
  note: NoteView,
  tape: TapeView,
  arrow: ArrowView,
};

export type { ViewProps } from './glyphs';
export * from './style';

export { ItemView } from './ItemView';
export { SketchView } from './SketchView';
export * from './style';

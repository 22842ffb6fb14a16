export { ItemView } from './ItemView';
export * from '../../drawing/theme';

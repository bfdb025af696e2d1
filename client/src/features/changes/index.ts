// What the rest of the app may use from the changes feature (comparing two revisions).
export { ChangesView, type ChangesViewProps } from './components/changes-view';
export { useChangeColouring } from './hooks/use-change-colouring';
export type { ChangeColouring } from './components/change-colouring';

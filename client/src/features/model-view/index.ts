export { ModelView } from './components/model-view-lazy';
export type { ModelViewProps } from './components/model-view';
export type { MemberOverlay, OverlayChoice, OverlayEntry } from './scene/member-overlay';

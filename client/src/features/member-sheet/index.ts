// What the rest of the app may use from the member-sheet feature.
export { MemberSheetView, type MemberSheetViewProps } from './components/member-sheet';
export { EndDrawing } from './components/end-drawing';

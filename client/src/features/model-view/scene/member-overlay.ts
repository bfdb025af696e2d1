/**
 * A page-given way to colour members other than by result band (for instance: change since
 * an earlier revision). The view knows nothing of what the entries mean: it draws each
 * named member in its entry's colour, the rest faint, and shows the page's words. The key
 * is drawn from the same entries the colours come from.
 */
export interface OverlayEntry {
  id: string;
  label: string;
  description: string;
  /** #RRGGBB */
  colour: string;
  /** A second cue in 3D (dark outline and thick axis), as over-utilised members have. */
  outlined?: boolean;
}

export interface OverlayMember {
  /** Which entry colours the member. */
  entry: string;
  /** Everything the page wants said about the member (hover and the picked member's card). */
  words: string[];
}

export interface MemberOverlay {
  /** Heading of the key, e.g. "Change since revision 1". */
  title: string;
  /** Key lines, in the order they are listed. */
  entries: OverlayEntry[];
  /** Members the overlay names, by GlobalId. */
  members: ReadonlyMap<string, OverlayMember>;
  /** Steel the overlay does not name: drawn faint and see-through. */
  rest: { label: string; description: string; words: string };
  /** How to read the key (e.g. which colour wins when a member has several). */
  note?: string;
  /** Members the overlay names that are not in this model, so cannot be drawn: listed beside the view. */
  absent?: { title: string; empty: string; members: { globalId: string; label: string; words: string[]; href?: string }[] };
  /** Warnings to keep in sight while the overlay is shown. */
  warnings?: string[];
}

/** The "Colour by" choice a page offers besides result bands; the page loads the overlay only once it is chosen. */
export interface OverlayChoice {
  /** Name in the "Colour by" list, e.g. "change since revision 1". */
  label: string;
  active: boolean;
  onActiveChange(active: boolean): void;
  /** null while loading (or before it is chosen). */
  overlay: MemberOverlay | null;
  /** Why it could not be made. */
  error?: string | null;
}

/** Which overlay entry, if any, draws each scene entry (by index); -1 = not named (faint). */
export function overlayIndexOf(globalIds: readonly string[], overlay: MemberOverlay): Int16Array {
  const position = new Map(overlay.entries.map((e, k) => [e.id, k]));
  const out = new Int16Array(globalIds.length).fill(-1);
  globalIds.forEach((g, i) => {
    const m = overlay.members.get(g);
    if (m) out[i] = position.get(m.entry) ?? -1;
  });
  return out;
}

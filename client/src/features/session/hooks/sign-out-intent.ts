/**
 * Remembers whether the last sign-out was the person's own choice, so the route
 * guard can send them to a plain sign-in page rather than back to where they were
 * (which it does when a session simply runs out).
 */
let deliberate = false;

export function markSignedOutDeliberately(): void {
  deliberate = true;
}

export function clearSignOutIntent(): void {
  deliberate = false;
}

export function wasSignedOutDeliberately(): boolean {
  return deliberate;
}

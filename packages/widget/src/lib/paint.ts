/** Runs `then` once the browser has painted the widget (and had a moment to spare). */
export function afterFirstPaint(then: () => void): void {
  requestAnimationFrame(() => setTimeout(then, 0));
}

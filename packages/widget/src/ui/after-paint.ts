/**
 * Runs `then` in a task of its own once the frame that shows the DOM as it is now has been rendered:
 * called while rendering (a layout effect, before the browser paints), the animation-frame callback
 * runs in that very frame, and the task it posts runs after the frame's style, layout and paint.
 * Returns a function that cancels it, whichever of the two steps it is waiting on.
 */
export function afterThisPaint(then: () => void): () => void {
  let timer: ReturnType<typeof setTimeout> | undefined;
  const frame = requestAnimationFrame(() => {
    timer = setTimeout(then, 0);
  });
  return () => {
    cancelAnimationFrame(frame);
    if (timer !== undefined) clearTimeout(timer);
  };
}

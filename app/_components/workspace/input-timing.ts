"use client";

// Input-to-paint timing the workspace records about itself, with the browser's User Timing
// marks: `npm run bench` (scripts/bench-browser.mts) types into the desk and reads the
// measures back. Each input event of a number field is a mark at the event's own time stamp
// (so time spent waiting for the main thread counts); the marks are bound to the next
// engine run that includes them; once that run's result (or its error) is committed, the
// frame that shows it is awaited (requestAnimationFrame, then a message: that callback runs
// after the frame has been painted) and one measure per input is taken up to that moment.
// That frame shows the new result wherever the page is in view (the summary bar, the panels on
// screen); the plots and the panels out of view follow in a deferred render after it
// (foundation-workspace.tsx). A second measure per input, INPUT_TO_SETTLED, runs to the frame
// after that deferred render, when every part of the page shows the result (the badge then
// says "results current" again, unless the speed ramps are still to come).
// Cheap enough to stay on: marks are cleared once measured, measures are capped.

/** The name of every input-to-paint measure (performance.getEntriesByName). */
export const INPUT_TO_PAINT = "plinth:input-to-paint";
/** From the same input to the frame in which the deferred parts (plots, panels out of view) show the result too. */
export const INPUT_TO_SETTLED = "plinth:input-to-settled";
const MAX_MEASURES = 1000;

let count = 0;
const pending: string[] = [];
const bound = new Map<number, string[]>();
/** Inputs measured to paint, waiting for the deferred render (their marks are kept until then). */
const unsettled: string[] = [];

function timingAvailable(): boolean {
  return typeof performance !== "undefined" && typeof performance.mark === "function" && typeof requestAnimationFrame === "function";
}

/** `then` runs once the next frame has been painted. */
function afterNextPaint(then: () => void): void {
  requestAnimationFrame(() => {
    const channel = new MessageChannel();
    channel.port1.onmessage = () => {
      channel.port1.close();
      then();
    };
    channel.port2.postMessage(null);
  });
}

function measureEach(name: string, starts: readonly string[], end: string): void {
  if (performance.getEntriesByName(name).length > MAX_MEASURES) performance.clearMeasures(name);
  for (const start of starts) performance.measure(name, start, end);
}

/** An input event of a field that feeds the engine; `at` is the event's timeStamp. */
export function markInput(at: number): void {
  if (!timingAvailable()) return;
  const name = `plinth:input:${++count}`;
  performance.mark(name, { startTime: at });
  pending.push(name);
}

/** The engine run `seq` is sent with the inputs typed so far. */
export function bindInputs(seq: number): void {
  if (pending.length) bound.set(seq, pending.splice(0));
}

/**
 * Run `seq`'s answer has been committed to the page: measure every input it (or an older,
 * dropped run) carried once it is painted. `deferred` false (an error, nothing new to draw
 * later): that frame settles them too.
 */
export function markCommitted(seq: number, deferred = true): void {
  if (!timingAvailable()) return;
  const starts: string[] = [];
  for (const [s, marks] of bound) {
    if (s > seq) continue;
    starts.push(...marks);
    bound.delete(s);
  }
  if (!starts.length) return;
  afterNextPaint(() => {
    const end = `plinth:painted:${seq}`;
    performance.mark(end);
    measureEach(INPUT_TO_PAINT, starts, end);
    if (deferred) unsettled.push(...starts);
    else {
      measureEach(INPUT_TO_SETTLED, starts, end);
      for (const start of starts) performance.clearMarks(start);
    }
    performance.clearMarks(end);
  });
}

/**
 * The deferred parts have caught up with the result on screen: measure every input painted so
 * far up to the frame that shows them (an input whose own deferred render was overtaken by a
 * newer result is measured to this one), and forget their marks.
 */
export function markSettled(): void {
  if (!timingAvailable() || !unsettled.length) return;
  const starts = unsettled.splice(0);
  afterNextPaint(() => {
    const end = `plinth:settled:${++count}`;
    performance.mark(end);
    measureEach(INPUT_TO_SETTLED, starts, end);
    performance.clearMarks(end);
    for (const start of starts) performance.clearMarks(start);
  });
}

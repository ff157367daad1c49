"use client";

// Input-to-paint timing the workspace records about itself, with the browser's User Timing
// marks: `npm run bench` (scripts/bench-browser.mts) types into the desk and reads the
// measures back. Each input event of a number field is a mark at the event's own time stamp
// (so time spent waiting for the main thread counts); the marks are bound to the next
// engine run that includes them; once that run's result (or its error) is committed, the
// frame that shows it is awaited (requestAnimationFrame, then a message: that callback runs
// after the frame has been painted) and one measure per input is taken up to that moment.
// Cheap enough to stay on: marks are cleared once measured, measures are capped.

/** The name of every input-to-paint measure (performance.getEntriesByName). */
export const INPUT_TO_PAINT = "plinth:input-to-paint";
const MAX_MEASURES = 1000;

let count = 0;
const pending: string[] = [];
const bound = new Map<number, string[]>();

function timingAvailable(): boolean {
  return typeof performance !== "undefined" && typeof performance.mark === "function" && typeof requestAnimationFrame === "function";
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

/** Run `seq`'s answer has been committed to the page: measure every input it (or an older, dropped run) carried once it is painted. */
export function markCommitted(seq: number): void {
  if (!timingAvailable()) return;
  const starts: string[] = [];
  for (const [s, marks] of bound) {
    if (s > seq) continue;
    starts.push(...marks);
    bound.delete(s);
  }
  if (!starts.length) return;
  requestAnimationFrame(() => {
    const channel = new MessageChannel();
    channel.port1.onmessage = () => {
      channel.port1.close();
      const end = `plinth:painted:${seq}`;
      performance.mark(end);
      if (performance.getEntriesByName(INPUT_TO_PAINT).length > MAX_MEASURES) performance.clearMeasures(INPUT_TO_PAINT);
      for (const start of starts) {
        performance.measure(INPUT_TO_PAINT, start, end);
        performance.clearMarks(start);
      }
      performance.clearMarks(end);
    };
    channel.port2.postMessage(null);
  });
}

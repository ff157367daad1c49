"use client";

import { startTransition, useEffect, useState, type RefObject } from "react";

/**
 * `value`, one painted frame late: once the frame that shows the new `value` elsewhere has been
 * painted (requestAnimationFrame, then a message), it is taken over in a transition (an
 * interruptible render: a keystroke meanwhile goes first). The plots and the panels out of view
 * draw the result from this copy, so the frame with the verdicts and the summary is not held up
 * by them (useDeferredValue starts its render at once and may delay that frame). Typing cost,
 * issue 15 item 2.
 */
export function useAfterPaint<T>(value: T): T {
  const [late, setLate] = useState(value);
  useEffect(() => {
    if (Object.is(late, value)) return;
    let live = true;
    const frame = requestAnimationFrame(() => {
      const channel = new MessageChannel();
      channel.port1.onmessage = () => {
        channel.port1.close();
        if (live) startTransition(() => setLate(value));
      };
      channel.port2.postMessage(null);
    });
    return () => {
      live = false;
      cancelAnimationFrame(frame);
    };
  }, [value, late]);
  return late;
}

/**
 * Whether the element is within `marginPx` of the viewport (IntersectionObserver); true until
 * first observed, so a panel starts out drawing the current result.
 */
export function useNearViewport(ref: RefObject<Element | null>, marginPx = 300): boolean {
  const [near, setNear] = useState(true);
  useEffect(() => {
    const el = ref.current;
    if (!el || typeof IntersectionObserver === "undefined") return;
    const io = new IntersectionObserver((entries) => {
      const last = entries[entries.length - 1];
      if (last) setNear(last.isIntersecting);
    }, { rootMargin: `${marginPx}px 0px` });
    io.observe(el);
    return () => io.disconnect();
  }, [ref, marginPx]);
  return near;
}

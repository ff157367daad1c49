"use client";

import { useEffect, useRef } from "react";
import { isInAppLeave } from "@/modules/desk/draft-autosave";

/**
 * Sent (cancelable) on window by code that navigates without a link, e.g. the header's project
 * switcher: a guard that is active asks, and cancels the event when the person stays.
 */
export const BEFORE_LEAVE_EVENT = "plinthwise:before-leave";

/** True when the page may be left (no guard, or the person agreed). */
export function confirmLeave(): boolean {
  return window.dispatchEvent(new Event(BEFORE_LEAVE_EVENT, { cancelable: true }));
}

/**
 * Asks before the page is left while `active`: closing or reloading the tab (beforeunload),
 * an in-app link (the header's, the breadcrumb's: Next's Link navigates without unloading, so
 * beforeunload never fires), a form outside `root` (signing out), and the browser's back and
 * forward buttons (popstate). The listeners sit on window in the capture phase, so they run
 * before React's and Next's own handlers and can stop them.
 */
export function useLeaveGuard(active: boolean, message: string, root: React.RefObject<HTMLElement | null>, onStay?: () => void): void {
  const activeRef = useRef(active);
  const messageRef = useRef(message);
  const onStayRef = useRef(onStay);
  useEffect(() => {
    activeRef.current = active;
    messageRef.current = message;
    onStayRef.current = onStay;
  });

  useEffect(() => {
    // Set once the person has agreed to leave, so the unload that follows does not ask again.
    let leaving = false;
    let ignoreNextPop = false;
    let replaying = false;
    // Where this page sits in the session history (Navigation API, Chromium and others), so a
    // refused back or forward can step back to it whichever way the browser went.
    const here = (): number | undefined => (window as unknown as { navigation?: { currentEntry?: { index: number } } }).navigation?.currentEntry?.index;
    const homeIndex = here();
    const ask = (): boolean => {
      if (!activeRef.current || leaving) return true;
      const ok = window.confirm(messageRef.current);
      if (ok) leaving = true;
      else onStayRef.current?.();
      return ok;
    };

    const onBeforeUnload = (e: BeforeUnloadEvent) => {
      if (!activeRef.current || leaving) return;
      e.preventDefault();
      // Older browsers need returnValue set; the text itself is not shown by any modern one.
      e.returnValue = "";
    };

    const onClick = (e: MouseEvent) => {
      if (e.defaultPrevented || e.button !== 0 || e.metaKey || e.ctrlKey || e.shiftKey || e.altKey) return;
      const a = (e.target as Element | null)?.closest?.("a[href]");
      if (!(a instanceof HTMLAnchorElement) || a.hasAttribute("download") || (a.target && a.target !== "_self")) return;
      if (!isInAppLeave(a.href, window.location.href)) return;
      if (!ask()) {
        e.preventDefault();
        e.stopImmediatePropagation();
      }
    };

    const onSubmit = (e: SubmitEvent) => {
      const form = e.target as HTMLFormElement | null;
      if (!form || root.current?.contains(form)) return;
      if (!ask()) {
        e.preventDefault();
        e.stopImmediatePropagation();
      }
    };

    const onPopState = (e: PopStateEvent) => {
      if (replaying) return;
      if (ignoreNextPop) {
        // The step forward that undid a refused back: the page is still this one.
        ignoreNextPop = false;
        e.stopImmediatePropagation();
        return;
      }
      if (!activeRef.current || leaving) return;
      // The history has already moved; Next has not rendered the other page yet.
      e.stopImmediatePropagation();
      if (window.confirm(messageRef.current)) {
        leaving = true;
        // Hand the same event to Next's router, which now shows the page the browser went to.
        replaying = true;
        window.dispatchEvent(new PopStateEvent("popstate", { state: e.state as unknown }));
        replaying = false;
      } else {
        const now = here();
        ignoreNextPop = true;
        window.history.go(homeIndex !== undefined && now !== undefined && now !== homeIndex ? homeIndex - now : 1);
        onStayRef.current?.();
      }
    };

    const onBeforeLeave = (e: Event) => {
      if (!ask()) e.preventDefault();
    };

    window.addEventListener(BEFORE_LEAVE_EVENT, onBeforeLeave);
    window.addEventListener("beforeunload", onBeforeUnload);
    window.addEventListener("click", onClick, true);
    window.addEventListener("submit", onSubmit, true);
    window.addEventListener("popstate", onPopState, true);
    return () => {
      window.removeEventListener(BEFORE_LEAVE_EVENT, onBeforeLeave);
      window.removeEventListener("beforeunload", onBeforeUnload);
      window.removeEventListener("click", onClick, true);
      window.removeEventListener("submit", onSubmit, true);
      window.removeEventListener("popstate", onPopState, true);
    };
  }, [root]);
}

"use client";

import { useEffect, useRef } from "react";
import { isInAppLeave } from "@/modules/desk/draft-autosave";

// The parts of the Navigation API used here (not yet in TypeScript's DOM library).
interface NavigateEventLike extends Event {
  navigationType: "push" | "replace" | "reload" | "traverse";
}
interface NavigationLike {
  addEventListener(type: "navigate", listener: (e: NavigateEventLike) => void): void;
  removeEventListener(type: "navigate", listener: (e: NavigateEventLike) => void): void;
}

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
 * forward buttons. Clicks and submits are caught on window in the capture phase, before React's
 * and Next's own handlers. Back and forward are caught by the Navigation API's cancelable
 * `navigate` event (traverse), which comes before the history moves: popstate comes too late,
 * since Next's popstate listener, registered first on window, runs first and unmounts this page
 * synchronously. A browser without the Navigation API is not asked on back and forward.
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
    const navigation = (window as unknown as { navigation?: NavigationLike }).navigation;
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

    const onNavigate = (e: NavigateEventLike) => {
      if (e.navigationType !== "traverse" || !e.cancelable || !activeRef.current || leaving) return;
      if (window.confirm(messageRef.current)) leaving = true;
      else {
        e.preventDefault();
        onStayRef.current?.();
      }
    };

    const onBeforeLeave = (e: Event) => {
      if (!ask()) e.preventDefault();
    };

    navigation?.addEventListener("navigate", onNavigate);
    window.addEventListener(BEFORE_LEAVE_EVENT, onBeforeLeave);
    window.addEventListener("beforeunload", onBeforeUnload);
    window.addEventListener("click", onClick, true);
    window.addEventListener("submit", onSubmit, true);
    return () => {
      navigation?.removeEventListener("navigate", onNavigate);
      window.removeEventListener(BEFORE_LEAVE_EVENT, onBeforeLeave);
      window.removeEventListener("beforeunload", onBeforeUnload);
      window.removeEventListener("click", onClick, true);
      window.removeEventListener("submit", onSubmit, true);
    };
  }, [root]);
}

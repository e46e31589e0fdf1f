"use client";
import { useEffect } from "react";

/** Scrolls the build's tab bar so the current tab is in view (on a phone the bar is wider than the screen). */
export function TabScroller({ navId }: { navId: string }) {
  useEffect(() => {
    const nav = document.getElementById(navId);
    const cur = nav?.querySelector<HTMLElement>('[aria-current="page"]');
    if (!nav || !cur) return;
    const left = cur.offsetLeft - nav.offsetLeft;
    if (left + cur.offsetWidth > nav.scrollLeft + nav.clientWidth || left < nav.scrollLeft) nav.scrollLeft = Math.max(0, left - (nav.clientWidth - cur.offsetWidth) / 2);
  }, [navId]);
  return null;
}

"use client";

import { createContext, useCallback, useContext, useLayoutEffect, useMemo, useState, useSyncExternalStore } from "react";
import { NIGHT_VISION_COOKIE } from "@/lib/tonight/night-vision";
import { parseTheme, THEME_COOKIE } from "@/lib/theme";
import { cn } from "@/lib/cn";

interface NightVision {
  on: boolean;
  toggle: () => void;
}

const NightVisionContext = createContext<NightVision>({ on: false, toggle: () => undefined });

function usualTheme(): string {
  const match = document.cookie.match(new RegExp(`(?:^|; )${THEME_COOKIE}=([^;]*)`));
  return parseTheme(match?.[1]);
}

const noSubscription = () => () => undefined;

/**
 * Paints the red theme before the first paint of a full page load. The script only runs
 * when it arrives in server HTML; on client navigations React would render it inert (and
 * complain), so it is kept only while hydrating — the layout effect covers the rest.
 */
function FirstPaintScript({ on }: { on: boolean }) {
  const hydrating = useSyncExternalStore(noSubscription, () => false, () => true);
  if (!on || !hydrating) return null;
  return <script dangerouslySetInnerHTML={{ __html: `document.documentElement.dataset.theme="red"` }} />;
}

/** Holds the night-vision switch for tonight's pages and sets data-theme="red" on <html> while it is on. */
export function NightVisionProvider({ initialOn, children }: { initialOn: boolean; children: React.ReactNode }) {
  const [on, setOn] = useState(initialOn);

  useLayoutEffect(() => {
    const html = document.documentElement;
    html.dataset.theme = on ? "red" : usualTheme();
    // Leaving tonight's pages gives the person's usual theme back.
    return () => {
      html.dataset.theme = usualTheme();
    };
  }, [on]);

  const toggle = useCallback(() => {
    document.cookie = `${NIGHT_VISION_COOKIE}=${on ? "off" : "on"}; path=/; max-age=31536000; samesite=lax`;
    setOn(!on);
  }, [on]);

  const value = useMemo(() => ({ on, toggle }), [on, toggle]);
  return (
    <NightVisionContext.Provider value={value}>
      <FirstPaintScript on={initialOn} />
      {children}
    </NightVisionContext.Provider>
  );
}

export function NightVisionToggle({ className }: { className?: string }) {
  const { on, toggle } = useContext(NightVisionContext);
  return (
    <button
      type="button"
      onClick={toggle}
      aria-pressed={on}
      title={on ? "Switch night vision off" : "Dim red on black, to keep your eyes dark-adapted"}
      className={cn("tn-button inline-flex items-center gap-2 rounded-md border border-line bg-raised px-3 py-2 font-medium text-text hover:bg-sunken", className)}
    >
      <span aria-hidden="true" className={cn("tn-switch", on && "tn-switch-on")} />
      Night vision
    </button>
  );
}

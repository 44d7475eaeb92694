"use client";

import { useState } from "react";
import { THEME_COOKIE, type Theme } from "@/lib/theme";

export function ThemeToggle({ initial }: { initial: Theme }) {
  const [theme, setTheme] = useState<Theme>(initial);
  function toggle() {
    const next: Theme = theme === "day" ? "night" : "day";
    document.documentElement.dataset.theme = next;
    document.cookie = `${THEME_COOKIE}=${next}; path=/; max-age=31536000; samesite=lax`;
    setTheme(next);
  }
  return (
    <button type="button" onClick={toggle} className="text-xs text-muted hover:text-text" aria-label={`Switch to the ${theme === "day" ? "night" : "day"} theme`}>
      {theme === "day" ? "☾ Night" : "☀ Day"}
    </button>
  );
}

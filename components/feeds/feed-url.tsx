"use client";

import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";

/** The new feed's address, shown once, with a copy button. */
export function FeedUrl({ path, label }: { path: string; label: string }) {
  // Rendered only after the create action answers, so always in the browser.
  const [origin] = useState(() => (typeof window === "undefined" ? "" : window.location.origin));
  const [copied, setCopied] = useState(false);
  const url = `${origin}${path}`;

  async function copy() {
    try {
      await navigator.clipboard.writeText(url);
      setCopied(true);
    } catch {
      setCopied(false); // no clipboard permission: the field stays selectable by hand
    }
  }

  return (
    <Alert tone="ok">
      <p className="mb-2">
        {label}: copy this address now and subscribe to it in your calendar app. It is shown only once.
      </p>
      <div className="flex flex-wrap items-center gap-2">
        <input readOnly aria-label="Feed URL" value={url} className={`${inputClass} num min-w-0 flex-1 text-xs`} onFocus={(e) => e.currentTarget.select()} />
        <Button type="button" variant="quiet" onClick={copy}>{copied ? "Copied" : "Copy"}</Button>
      </div>
    </Alert>
  );
}

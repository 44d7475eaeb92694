"use client";

import { useState, useTransition } from "react";
import type { ActionResult } from "@/lib/actions/result";
import { ROLE_LABELS, ROLES, type Role } from "@/lib/auth/roles";

export function RoleEditor({
  userId,
  userName,
  initial,
  action,
}: {
  userId: string;
  userName: string;
  initial: Role[];
  action: (input: unknown) => Promise<ActionResult>;
}) {
  const [roles, setRoles] = useState<Role[]>(initial);
  const [result, setResult] = useState<ActionResult | null>(null);
  const [pending, startTransition] = useTransition();

  function toggle(role: Role, on: boolean) {
    const next = on ? [...roles, role] : roles.filter((r) => r !== role);
    const previous = roles;
    setRoles(next);
    startTransition(async () => {
      const answer = await action({ userId, roles: next });
      setResult(answer);
      if (!answer.ok) setRoles(previous); // the server refused: show what is really stored
    });
  }

  return (
    <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
      {ROLES.map((role) => (
        <label key={role} className="flex items-center gap-1 text-xs">
          <input
            type="checkbox"
            checked={roles.includes(role)}
            disabled={pending}
            aria-label={`${ROLE_LABELS[role]} role for ${userName}`}
            onChange={(e) => toggle(role, e.target.checked)}
          />
          {ROLE_LABELS[role]}
        </label>
      ))}
      {result && !result.ok && <span role="alert" className="text-xs text-danger">{result.message}</span>}
    </div>
  );
}

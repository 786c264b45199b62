import { useEffect, useId, useRef, useState } from "react";
import { Link, useNavigate } from "react-router-dom";
import type { Me } from "@shared/schemas/auth";
import { useSignOut } from "../../api/auth";
import { useCurrentLabId } from "../labs/useCurrentLabId";

const itemClass = "block w-full px-4 py-2 text-left text-sm text-ink hover:bg-paper-sunk focus-visible:bg-paper-sunk";

/** The signed-in person's menu: account settings, the lab's people, sign out. Escape closes it. */
export function AccountMenu({ me }: { me: Me }) {
  const [open, setOpen] = useState(false);
  const menuId = useId();
  const ref = useRef<HTMLDivElement>(null);
  const buttonRef = useRef<HTMLButtonElement>(null);
  const labId = useCurrentLabId();
  const signOut = useSignOut();
  const navigate = useNavigate();

  useEffect(() => {
    if (!open) return;
    const onDown = (e: MouseEvent) => ref.current && !ref.current.contains(e.target as Node) && setOpen(false);
    const onKey = (e: KeyboardEvent) => {
      if (e.key !== "Escape") return;
      setOpen(false);
      buttonRef.current?.focus();
    };
    document.addEventListener("mousedown", onDown);
    document.addEventListener("keydown", onKey);
    return () => {
      document.removeEventListener("mousedown", onDown);
      document.removeEventListener("keydown", onKey);
    };
  }, [open]);

  const close = () => setOpen(false);
  return (
    <div ref={ref} className="relative">
      <button
        ref={buttonRef}
        type="button"
        aria-expanded={open}
        aria-controls={menuId}
        onClick={() => setOpen((o) => !o)}
        className="flex items-center gap-2 rounded-md border border-paper-sunk px-3 py-1.5 text-sm font-bold text-ink hover:bg-paper-sunk"
      >
        <span aria-hidden="true" className="flex h-6 w-6 items-center justify-center rounded-full bg-petrol-700 text-xs text-paper-raised">
          {me.displayName.trim().charAt(0).toUpperCase() || "?"}
        </span>
        <span className="max-w-40 truncate">{me.displayName}</span>
        <span aria-hidden="true" className="text-ink-faint">
          ▾
        </span>
      </button>
      {open && (
        <div id={menuId} className="absolute right-0 z-40 mt-1 w-64 rounded-md border border-paper-sunk bg-paper-raised py-1 shadow-lg">
          <p className="truncate border-b border-paper-sunk px-4 pb-2 pt-1 text-xs text-ink-faint" title={me.email}>Signed in as {me.email}</p>
          <Link className={itemClass} to="/account" onClick={close}>
            Account settings
          </Link>
          {labId && (
            <Link className={itemClass} to={`/labs/${labId}/members`} onClick={close}>
              People in this lab
            </Link>
          )}
          {labId && (
            <Link className={itemClass} to={`/labs/${labId}/shares`} onClick={close}>
              Links and guests of this lab
            </Link>
          )}
          {labId && (
            <Link className={itemClass} to={`/labs/${labId}/import`} onClick={close}>
              Import a session bundle
            </Link>
          )}
          <Link className={itemClass} to="/shared-with-me" onClick={close}>
            Shared with me
          </Link>
          <Link className={itemClass} to="/tokens" onClick={close}>
            API tokens
          </Link>
          <Link className={itemClass} to="/labs/new" onClick={close}>
            Create a lab
          </Link>
          <button
            type="button"
            className={`${itemClass} border-t border-paper-sunk`}
            disabled={signOut.isPending}
            onClick={() =>
              signOut.mutate(undefined, {
                onSuccess: () => {
                  close();
                  navigate("/sign-in");
                },
              })
            }
          >
            {signOut.isPending ? "Signing out…" : "Sign out"}
          </button>
        </div>
      )}
    </div>
  );
}

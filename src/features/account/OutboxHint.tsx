import { Link } from "react-router-dom";
import { useDevOutbox } from "../../api/devOutbox";
import { linkClass } from "./AuthCard";

/** On a development server (mail caught locally), points to the outbox where the link arrived. */
export function OutboxHint() {
  const outbox = useDevOutbox();
  if (!outbox.isSuccess) return null;
  return (
    <p className="rounded-md bg-paper-sunk px-3 py-2 text-sm text-ink-soft">
      This server does not send real e-mail. Find the message in the <Link className={linkClass} to="/dev/outbox">development outbox</Link>.
    </p>
  );
}

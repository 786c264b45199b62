import { Outlet } from "react-router-dom";
import { useMe } from "../api/auth";
import { useLabs } from "../api/labs";
import { HeaderAccountArea } from "../features/account/HeaderAccountArea";
import { AppHeader, type NavItem } from "./AppHeader";

const SHARED_WITH_ME: NavItem[] = [{ to: "/shared-with-me", label: "Shared with me" }];

/** Page frame: skip link, header, main content, footer. */
export function AppLayout() {
  const me = useMe();
  const labs = useLabs(!!me.data);
  // Until the labs are known, assume membership (no flicker for members); then only real labs.
  const inLab = (labId: string) => !labs.isSuccess || labs.data.some((l) => l.id === labId);
  const labless = labs.isSuccess && labs.data.length === 0;
  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-paper-raised focus:px-3 focus:py-2">
        Skip to content
      </a>
      <AppHeader right={<HeaderAccountArea />} inLab={inLab} extraNav={labless ? SHARED_WITH_ME : []} />
      <main id="main" className="mx-auto w-full max-w-7xl flex-1 px-4 py-6">
        <Outlet />
      </main>
      <footer className="border-t border-paper-sunk py-3 text-center text-xs text-ink-faint">
        Rhomb — a shared notebook for two-photon polarization tomography
      </footer>
    </div>
  );
}

import { Link, NavLink, useMatch } from "react-router-dom";
import { RhombMark } from "./RhombMark";

export interface NavItem {
  to: string;
  label: string;
  end?: boolean;
}

const NAV: NavItem[] = [
  { to: "/", label: "Notebook", end: true },
  { to: "/status", label: "Status" },
];

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/**
 * Inside a lab (/labs/:labId/…) the lab's notebook pages come first — for its members only
 * (`inLab` false hides them from someone who followed a link into a lab not theirs).
 */
function useNav(inLab: (labId: string) => boolean): NavItem[] {
  const labId = useMatch("/labs/:labId/*")?.params.labId;
  if (!labId || !UUID.test(labId) || !inLab(labId)) return NAV;
  return [
    { to: `/labs/${labId}`, label: "Lab home", end: true },
    { to: `/labs/${labId}/sources`, label: "Sources" },
    { to: `/labs/${labId}/compare`, label: "Compare" },
    { to: `/labs/${labId}/trends`, label: "Trends" },
    { to: `/labs/${labId}/batches`, label: "Batch upload" },
    { to: `/labs/${labId}/members`, label: "People" },
    ...NAV.filter((n) => n.to !== "/"),
  ];
}

const linkClass = ({ isActive }: { isActive: boolean }) =>
  [
    "rounded-md px-3 py-1.5 text-sm font-bold transition-colors",
    isActive ? "bg-petrol-700 text-paper-raised" : "text-ink-soft hover:bg-paper-sunk hover:text-ink",
  ].join(" ");

/** The top bar: mark, wordmark, primary navigation, and a slot for the account menu. */
export function AppHeader({ nav: navProp, right, inLab = () => true, extraNav = [] }: { nav?: NavItem[]; right?: React.ReactNode; inLab?: (labId: string) => boolean; extraNav?: NavItem[] }) {
  const labNav = useNav(inLab);
  const nav = [...(navProp ?? labNav), ...extraNav];
  return (
    <header className="border-b-2 border-petrol-700 bg-paper-raised">
      <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-2.5">
        <Link to="/" className="flex items-center gap-2 text-petrol-700" aria-label="Rhomb home">
          <RhombMark />
          <span className="text-xl font-bold tracking-tight text-ink">Rhomb</span>
        </Link>
        <nav aria-label="Main" className="flex flex-wrap items-center gap-1">
          {nav.map((item) => (
            <NavLink key={item.to} to={item.to} end={item.end} className={linkClass}>
              {item.label}
            </NavLink>
          ))}
        </nav>
        <div className="ml-auto flex items-center gap-3">{right}</div>
      </div>
    </header>
  );
}

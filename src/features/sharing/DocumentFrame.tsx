import { Link } from "react-router-dom";
import { RhombMark } from "../../components/RhombMark";

/**
 * The frame of pages that stand on their own — a shared item opened from a link, a printable
 * report: the mark, a toolbar that never prints, and the document. No lab navigation.
 */
export function DocumentFrame({ toolbar, children }: { toolbar?: React.ReactNode; children: React.ReactNode }) {
  return (
    <div className="min-h-screen bg-paper print:bg-white">
      <header className="border-b-2 border-petrol-700 bg-paper-raised print:hidden">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-4 px-4 py-2.5">
          <Link to="/" className="flex items-center gap-2 text-petrol-700" aria-label="Rhomb home">
            <RhombMark />
            <span className="text-xl font-bold tracking-tight text-ink">Rhomb</span>
          </Link>
          <div className="ml-auto flex flex-wrap items-center gap-2">{toolbar}</div>
        </div>
      </header>
      <main id="main" className="mx-auto w-full max-w-6xl px-4 py-6 print:max-w-none print:p-0">
        {children}
      </main>
    </div>
  );
}

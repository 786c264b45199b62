import type { PageInfo } from "@shared/schemas/listing";
import { Button } from "../../components/Button";

/** "Page 2 of 5" with previous/next; nothing when everything fits on one page. */
export function Pager({ page, onPage }: { page: PageInfo; onPage: (n: number) => void }) {
  const pages = Math.max(1, Math.ceil(page.total / page.size));
  if (pages === 1) return null;
  return (
    <nav aria-label="Pages" className="mt-2 flex items-center gap-3 text-sm">
      <Button variant="secondary" size="sm" disabled={page.number <= 1} onClick={() => onPage(page.number - 1)}>
        Previous
      </Button>
      <span className="tabular-nums">
        Page {page.number} of {pages} ({page.total} in all)
      </span>
      <Button variant="secondary" size="sm" disabled={page.number >= pages} onClick={() => onPage(page.number + 1)}>
        Next
      </Button>
    </nav>
  );
}

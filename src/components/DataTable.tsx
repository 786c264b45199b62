export interface Column<T> {
  key: string;
  header: React.ReactNode;
  /** Numbers are right-aligned in tabular figures. */
  numeric?: boolean;
  /** Set when the column can be sorted (the key the server or caller sorts by). */
  sortKey?: string;
  render: (row: T) => React.ReactNode;
}

export interface SortState {
  key: string;
  order: "asc" | "desc";
}

/**
 * The one table component: a caption, sortable headers (buttons with aria-sort), numbers
 * right-aligned. Sorting itself is the caller's (usually the server's) job.
 */
export function DataTable<T>({ caption, columns, rows, rowKey, sort, onSort, empty, captionHidden = false }: {
  caption: string;
  columns: Column<T>[];
  rows: T[];
  rowKey: (row: T) => string;
  sort?: SortState;
  onSort?: (next: SortState) => void;
  empty?: React.ReactNode;
  captionHidden?: boolean;
}) {
  if (rows.length === 0 && empty) return <>{empty}</>;
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-sm">
        <caption className={captionHidden ? "sr-only" : "mb-2 text-left font-bold text-ink"}>{caption}</caption>
        <thead>
          <tr className="border-b-2 border-paper-sunk">
            {columns.map((c) => {
              const active = !!c.sortKey && sort?.key === c.sortKey;
              const ariaSort = active ? (sort!.order === "asc" ? "ascending" : "descending") : undefined;
              return (
                <th key={c.key} scope="col" aria-sort={c.sortKey ? (ariaSort ?? "none") : undefined} className={`px-2 py-1.5 font-bold text-ink-soft ${c.numeric ? "text-right" : "text-left"}`}>
                  {c.sortKey && onSort ? (
                    <button
                      type="button"
                      className="inline-flex items-center gap-1 font-bold hover:text-ink"
                      onClick={() => onSort({ key: c.sortKey!, order: active && sort!.order === "desc" ? "asc" : "desc" })}
                    >
                      {c.header}
                      <span aria-hidden="true" className={active ? "text-petrol-700" : "text-paper-sunk"}>
                        {active && sort!.order === "asc" ? "▲" : "▼"}
                      </span>
                    </button>
                  ) : (
                    c.header
                  )}
                </th>
              );
            })}
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={rowKey(row)} className="border-b border-paper-sunk hover:bg-paper">
              {columns.map((c) => (
                <td key={c.key} className={`px-2 py-1.5 ${c.numeric ? "num whitespace-nowrap" : ""}`}>
                  {c.render(row)}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

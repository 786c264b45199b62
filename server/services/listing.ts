import type { PageInfo } from "@shared/schemas/listing";

/** LIMIT/OFFSET of a 1-based page. */
export function pageWindow(page: number, pageSize: number): { take: number; skip: number } {
  return { take: pageSize, skip: (page - 1) * pageSize };
}

export function pageInfo(page: number, pageSize: number, total: number): PageInfo {
  return { number: page, size: pageSize, total };
}

/** A user's search text as an ILIKE pattern that matches it literally anywhere. */
export function containsPattern(q: string): string {
  return `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

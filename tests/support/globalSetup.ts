import type { TestProject } from "vitest/node";
import { createTestDatabase } from "./testDatabase";

declare module "vitest" {
  export interface ProvidedContext {
    databaseUrl: string;
  }
}

/** A fresh, migrated database for this run of the API tests, dropped afterwards. */
export default async function setup(project: TestProject) {
  const db = await createTestDatabase();
  project.provide("databaseUrl", db.databaseUrl);
  return db.drop;
}

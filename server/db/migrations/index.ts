import { Init1764633600000 } from "./1764633600000-Init";

/** Every migration in order, listed explicitly (no globs: tsx and vitest load files differently). */
export const migrations = [Init1764633600000];

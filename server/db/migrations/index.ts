import { Init1764633600000 } from "./1764633600000-Init";
import { Notebook1764720000000 } from "./1764720000000-Notebook";
import { AccountsAndInvitations1796171869331 } from "./1796171869331-AccountsAndInvitations";

/** Every migration in order, listed explicitly (no globs: tsx and vitest load files differently). */
export const migrations = [Init1764633600000, Notebook1764720000000, AccountsAndInvitations1796171869331];

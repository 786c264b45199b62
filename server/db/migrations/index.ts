import { Init1764633600000 } from "./1764633600000-Init";
import { Notebook1764720000000 } from "./1764720000000-Notebook";
import { AccountsAndInvitations1796171869331 } from "./1796171869331-AccountsAndInvitations";
import { Shares1796172629388 } from "./1796172629388-Shares";
import { ApiTokens1796171763588 } from "./1796171763588-ApiTokens";
import { Batches1796172782745 } from "./1796172782745-Batches";

/** Every migration in order, listed explicitly (no globs: tsx and vitest load files differently). */
export const migrations = [Init1764633600000, Notebook1764720000000, AccountsAndInvitations1796171869331, ApiTokens1796171763588, Batches1796172782745, Shares1796172629388];

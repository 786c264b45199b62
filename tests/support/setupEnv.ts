import { inject } from "vitest";
import { resetConfigForTests } from "../../server/config";

process.env.NODE_ENV = "test";
process.env.DATABASE_URL = inject("databaseUrl");
process.env.LOG_LEVEL = "silent";
resetConfigForTests();

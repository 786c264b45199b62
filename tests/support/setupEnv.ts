import { inject } from "vitest";
import { resetConfigForTests } from "../../server/config";

process.env.NODE_ENV = "test";
process.env.DATABASE_URL = inject("databaseUrl");
process.env.LOG_LEVEL = "silent";
// Mail goes to the in-process fake SMTP server (tests/support/mail.ts reads it), never out.
delete process.env.SMTP_URL;
process.env.RHOMB_FAKE_SMTP = "1";
resetConfigForTests();

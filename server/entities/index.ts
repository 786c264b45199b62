import { ApiToken } from "./ApiToken";
import { Attachment } from "./Attachment";
import { AuditEntry } from "./AuditEntry";
import { Batch } from "./Batch";
import { BatchFile } from "./BatchFile";
import { EmailToken } from "./EmailToken";
import { Invitation } from "./Invitation";
import { Lab } from "./Lab";
import { LabSession } from "./LabSession";
import { LabMembership } from "./LabMembership";
import { Reconstruction } from "./Reconstruction";
import { Run } from "./Run";
import { Share } from "./Share";
import { RunRevision } from "./RunRevision";
import { Source } from "./Source";
import { User } from "./User";

/** Every entity, listed explicitly (no globs: tsx and vitest load files differently). */
export const entities = [User, Lab, LabMembership, Source, LabSession, Run, RunRevision, Reconstruction, Attachment, AuditEntry, EmailToken, Invitation, ApiToken, Batch, BatchFile, Share];

export { EmailToken, Invitation, Lab, LabMembership, User };
export { Share };
export { Attachment, AuditEntry, LabSession, Reconstruction, Run, RunRevision, Source };
export { ApiToken, Batch, BatchFile };

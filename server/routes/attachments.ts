import { z } from "zod";
import { UuidSchema } from "@shared/schemas/listing";
import { ApiRouter } from "../http/endpoint";
import { runPolicy } from "../policies/runs";
import { readAttachment } from "../services/attachments";

export const attachmentsRouter = new ApiRouter("/labs");

const SAFE_TYPES = new Set(["text/csv", "text/plain", "text/tab-separated-values", "application/json"]);

const AttachmentParamsSchema = z.object({ labId: UuidSchema("Lab id"), attachmentId: UuidSchema("Attachment id") });

attachmentsRouter.get("/:labId/attachments/:attachmentId", { summary: "The bytes of an uploaded file, exactly as uploaded", auth: "user", tokenAccess: true, tags: ["runs"], params: AttachmentParamsSchema }, async ({ user, params, res }) => {
  await runPolicy.view(user, params.labId);
  const a = await readAttachment(params.labId, params.attachmentId);
  // The browser's claim about the type is stored, but only plain text types are served as such:
  // anything else (text/html, say) goes out as bytes, so an upload can never run in our origin.
  res.setHeader("Content-Type", SAFE_TYPES.has(a.contentType.split(";")[0].trim().toLowerCase()) ? a.contentType : "application/octet-stream");
  res.setHeader("Content-Length", String(a.content.length));
  res.setHeader("Content-Disposition", `attachment; filename="${a.fileName.replace(/["\\\r\n]/g, "_")}"; filename*=UTF-8''${encodeURIComponent(a.fileName)}`);
  res.setHeader("X-Content-SHA256", a.sha256);
  res.setHeader("X-Content-Type-Options", "nosniff");
  res.status(200).end(a.content);
  return undefined;
});

import { z } from "zod";
import { UuidSchema } from "@shared/schemas/listing";
import { ApiRouter } from "../http/endpoint";
import { runPolicy } from "../policies/runs";
import { readAttachment } from "../services/attachments";

export const attachmentsRouter = new ApiRouter("/labs");

const AttachmentParamsSchema = z.object({ labId: UuidSchema("Lab id"), attachmentId: UuidSchema("Attachment id") });

attachmentsRouter.get("/:labId/attachments/:attachmentId", { summary: "The bytes of an uploaded file, exactly as uploaded", auth: "user", tokenAccess: true, tags: ["runs"], params: AttachmentParamsSchema }, async ({ user, params, res }) => {
  await runPolicy.view(user, params.labId);
  const a = await readAttachment(params.labId, params.attachmentId);
  res.setHeader("Content-Type", a.contentType);
  res.setHeader("Content-Length", String(a.content.length));
  res.setHeader("Content-Disposition", `attachment; filename="${a.fileName.replace(/["\\\r\n]/g, "_")}"; filename*=UTF-8''${encodeURIComponent(a.fileName)}`);
  res.setHeader("X-Content-SHA256", a.sha256);
  res.setHeader("X-Content-Type-Options", "nosniff");
  res.status(200).end(a.content);
  return undefined;
});

import multer from "multer";
import { BUNDLE_LIMITS } from "@shared/schemas/bundle";
import { decodeUtf8Text } from "@shared/formats/utf8Text";
import { BundleExportQuerySchema, ImportBundleFieldsSchema, ImportedBundleSchema } from "@shared/schemas/exports";
import { LabIdParamsSchema } from "@shared/schemas/labs";
import { LabSessionIdParamsSchema } from "@shared/schemas/labSessions";
import { ApiRouter } from "../http/endpoint";
import { invalid } from "../http/errors";
import { sharePolicy } from "../policies/shares";
import { exportBundle, importBundle } from "../services/bundles";
import { sendFile } from "./exports";

/** Session bundles: a whole session as one JSON file, and importing one into a lab. */
export const bundlesRouter = new ApiRouter("/labs");
const tags = ["bundles"];

const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: BUNDLE_LIMITS.bytes, files: 1 } }).single("bundle");

bundlesRouter.get("/:labId/sessions/:sessionId/bundle", { summary: "The session as a bundle: setup, runs with every revision, reconstructions, uploaded files (private notes only with includePrivateNotes=true)", auth: "user", tokenAccess: true, tags, params: LabSessionIdParamsSchema, query: BundleExportQuerySchema }, async ({ user, res, params, query }) => {
  await sharePolicy.export(user, params.labId);
  sendFile(res, await exportBundle(params.labId, params.sessionId, query.includePrivateNotes));
});

bundlesRouter.post(
  "/:labId/bundles",
  { summary: "Import a session bundle (multipart file `bundle`, or JSON `{ bundle }`) as a new session with new ids; all or nothing", auth: "user", tokenAccess: true, tags, params: LabIdParamsSchema, body: ImportBundleFieldsSchema, upload, response: ImportedBundleSchema, status: 201 },
  async ({ req, user, params, body }) => {
    await sharePolicy.importBundle(user, params.labId);
    if (!req.file && body.bundle === undefined) throw invalid("bundle", "Attach the bundle file (a .rhomb.json exported from a session) as the form field “bundle”.");
    const decoded = req.file ? decodeUtf8Text(req.file.buffer) : { ok: true as const, text: JSON.stringify(body.bundle) };
    if (!decoded.ok) throw invalid("bundle", `The file is not UTF-8 text (${decoded.reason}); bundles are UTF-8 JSON as Rhomb exports them. Nothing was imported.`);
    const text = decoded.text;
    return importBundle(user, params.labId, text, body.sourceId);
  },
);

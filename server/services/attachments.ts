import { db } from "../db/dataSource";
import { Attachment } from "../entities/Attachment";
import { notFound } from "../http/errors";

/** An attachment of this lab with its bytes (which lists never load), or 404. */
export async function readAttachment(labId: string, id: string): Promise<Attachment> {
  const a = await db()
    .getRepository(Attachment)
    .createQueryBuilder("a")
    .addSelect("a.content")
    .where("a.id = :id AND a.lab_id = :labId", { id, labId })
    .getOne();
  if (!a) throw notFound("Attachment");
  return a;
}

import { In, type EntityManager } from "typeorm";
import { db } from "../db/dataSource";
import { Reconstruction } from "../entities/Reconstruction";
import { notFound } from "../http/errors";

/** A reconstruction of this lab with the number of the revision it used, or 404. */
export async function findReconstruction(labId: string, id: string, em: EntityManager = db().manager): Promise<{ reconstruction: Reconstruction; revisionNumber: number }> {
  const reconstruction = await em.findOne(Reconstruction, { where: { id, labId }, relations: { createdBy: true, revision: true } });
  if (!reconstruction) throw notFound("Reconstruction");
  return { reconstruction, revisionNumber: reconstruction.revision!.number };
}

/** Several by id (any order); ids of other labs are simply absent. */
export async function findReconstructions(labId: string, ids: string[]): Promise<Reconstruction[]> {
  return db().manager.find(Reconstruction, { where: { id: In(ids), labId }, relations: { createdBy: true, revision: true } });
}

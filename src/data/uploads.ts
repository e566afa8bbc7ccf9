/** Reading and deleting stored uploads for people (routes and pages). */
import * as repo from '@/db/repo/uploads';
import { notFound } from '@/src/server/errors';

export async function requireUpload(networkId: string, uploadId: string) {
  const u = await repo.getUpload(networkId, uploadId);
  if (!u) throw notFound('No such upload in this network.');
  return u;
}

export async function deleteUpload(networkId: string, uploadId: string) {
  if (!(await repo.deleteUpload(networkId, uploadId))) throw notFound('No such upload in this network.');
}

export const listUploads = repo.listUploads;

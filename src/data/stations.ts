/**
 * Station registry service: validated input in, AppErrors naming the field out.
 */
import { record } from '@/src/audit';
import * as repo from '@/db/repo/stations';
import { conflict, notFound } from '@/src/server/errors';
import { isUniqueViolation } from './pg-errors';
import type { StationInputBody } from './station-input';

export type { Station, StationSummary } from '@/db/repo/stations';

function toInput(body: StationInputBody): repo.StationInput {
  return { ...body, mainsHz: body.mainsHz as 50 | 60 };
}

function duplicate(code: string) {
  return conflict(`This network already has a station with code ${code}; choose another code.`, 'code');
}

function recordStation(networkId: string, actorId: string | null, action: 'created' | 'changed' | 'deleted', s: repo.Station) {
  return record({ networkId, actorId, action, subject: 'station', subjectId: s.id, summary: `station ${s.code} (${s.name})` });
}

export async function createStation(networkId: string, body: StationInputBody, actorId: string | null): Promise<repo.Station> {
  let out: repo.Station;
  try {
    out = await repo.createStation(networkId, toInput(body));
  } catch (e) {
    if (isUniqueViolation(e)) throw duplicate(body.code);
    throw e;
  }
  await recordStation(networkId, actorId, 'created', out);
  return out;
}

export async function updateStation(
  networkId: string,
  stationId: string,
  body: StationInputBody,
  actorId: string | null,
): Promise<repo.Station> {
  let out: repo.Station | null;
  try {
    out = await repo.updateStation(networkId, stationId, toInput(body));
  } catch (e) {
    if (isUniqueViolation(e)) throw duplicate(body.code);
    throw e;
  }
  if (!out) throw notFound('No such station in this network.');
  await recordStation(networkId, actorId, 'changed', out);
  return out;
}

export async function requireStation(networkId: string, stationId: string): Promise<repo.Station> {
  const s = await repo.getStation(networkId, stationId);
  if (!s) throw notFound('No such station in this network.');
  return s;
}

export async function deleteStation(networkId: string, stationId: string, actorId: string | null): Promise<void> {
  const s = await requireStation(networkId, stationId);
  if (!(await repo.deleteStation(networkId, stationId))) throw notFound('No such station in this network.');
  await recordStation(networkId, actorId, 'deleted', s);
}

export const listStations = repo.listStations;

/** The station, or null when the id is malformed or not in this network (pages turn that into a 404). */
export async function getStationOrNull(networkId: string, stationId: string): Promise<repo.Station | null> {
  if (!/^[0-9a-f-]{36}$/i.test(stationId)) return null;
  return repo.getStation(networkId, stationId);
}

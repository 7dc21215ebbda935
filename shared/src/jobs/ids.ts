import { v5 as uuidv5 } from 'uuid';

/**
 * The id of a record made automatically under a parent (a job's panels and checklist items).
 * A name-based UUID (RFC 9562 version 5) of the parent's id and a key, so the device that
 * creates the job offline and the server that applies it later make the same ids.
 */
export function childId(parentId: string, key: string): string {
  return uuidv5(key, parentId);
}

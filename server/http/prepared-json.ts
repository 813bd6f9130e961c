// Sending a PreparedJson answer.
import type { Response } from 'express';
import type { PreparedJson } from '../lib/prepared-json.ts';

/** Sends the text as JSON. When responses are checked against the OpenAPI document (tests), it
 * goes through res.json, which the checker watches; JSON.stringify(JSON.parse(text)) is the text
 * again for text that JSON.stringify wrote. */
export function sendPreparedJson(res: Response, prepared: PreparedJson<unknown>, checked: boolean): void {
  if (checked) {
    res.json(JSON.parse(prepared.text));
    return;
  }
  res.type('application/json').send(prepared.text);
}

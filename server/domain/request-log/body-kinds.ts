/** How the request log kept a body: see server/http/body-snapshot.ts. */
export const BODY_KINDS = ['none', 'json', 'text', 'multipart', 'binary', 'unread'] as const;
export type BodyKind = (typeof BODY_KINDS)[number];

import type { Request } from 'express';

/**
 * The change counter of a table family as the request's session query read it (undefined when the request did not
 * come through the lean session path): a listing may answer from its cache while the counter is unchanged.
 */
export type GenerationOf = (req: Request, name: string) => string | undefined;

import { z } from "zod";

/**
 * A moment in time as the API sends it: handlers may hand over the Date a query returns,
 * and the JSON body carries it as an ISO 8601 string (what JSON.stringify makes of a Date).
 */
export const timestamp = z.codec(z.union([z.date(), z.iso.datetime({ offset: true })]), z.iso.datetime({ offset: true }), {
  decode: (value) => (value instanceof Date ? value.toISOString() : value),
  encode: (value) => value,
});

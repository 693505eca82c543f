// Row ids are PostgreSQL `integer` columns (serial): 1 to 2^31 - 1
// (PostgreSQL documentation, "Numeric Types", table 8.2). A larger id can never
// name a row, and sending one to the database raises "out of range" (a 500),
// so every id a client sends is checked against this range first.
import { z } from "zod";

export const MAX_DB_ID = 2147483647;

/** An id written in digits: no sign, no leading zero, no "0x10", "1e3" or spaces; at most ten digits. */
export const ID_DIGITS = /^[1-9][0-9]{0,9}$/;

/** An id sent in a JSON body: a whole number from 1 to 2^31 - 1. */
export const dbId = z
  .number()
  .int("An id is a whole number.")
  .positive("An id starts at 1.")
  .max(MAX_DB_ID, `An id is at most ${MAX_DB_ID}.`);

/** An id sent as query text ("12"): digits only, no "0x10", "1e3" or spaces. */
export const dbIdText = z
  .string()
  .regex(ID_DIGITS, "An id is a whole number from 1, written in digits.")
  .transform(Number)
  .pipe(z.number().max(MAX_DB_ID, `An id is at most ${MAX_DB_ID}.`));

// Ids from clients must fit PostgreSQL `integer` (1 to 2147483647, PostgreSQL
// documentation, "Numeric Types", table 8.2) or they reach the database and 500.
import { describe, expect, it } from "vitest";
import { dbId, dbIdText, MAX_DB_ID } from "@/lib/validation/id";

describe("dbId", () => {
  it("accepts the integer column's range and nothing past it", () => {
    expect(dbId.parse(1)).toBe(1);
    expect(dbId.parse(MAX_DB_ID)).toBe(2 ** 31 - 1);
    for (const bad of [0, -1, 1.5, 2 ** 31, 2 ** 53, Number.POSITIVE_INFINITY, "1", true]) {
      expect(dbId.safeParse(bad).success, String(bad)).toBe(false);
    }
  });

  it("reads query text as plain digits only", () => {
    expect(dbIdText.parse("12")).toBe(12);
    for (const bad of ["2147483648", "0x10", "1e3", " 1", "01", "", "-1", "99999999999"]) {
      expect(dbIdText.safeParse(bad).success, bad).toBe(false);
    }
  });
});

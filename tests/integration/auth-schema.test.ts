import { getTableColumns, getTableName, type Table } from "drizzle-orm";
import { getAuthTables } from "better-auth/db";
import { describe, expect, it } from "vitest";
import * as schema from "@/db/schema";
import { auth } from "@/lib/auth/server";

// Drift check: every table and field better-auth expects for our configuration (core, organization
// plugin, database rate limiting) exists in db/schema with the same nullability. Runs offline.

const tables = getAuthTables(auth.options);

describe("better-auth tables match db/schema", () => {
  for (const [model, definition] of Object.entries(tables)) {
    it(`model ${model}`, () => {
      const table = (schema as Record<string, unknown>)[definition.modelName] as Table | undefined;
      expect(table, `db/schema exports no table named ${definition.modelName}`).toBeDefined();
      const columns = getTableColumns(table as Table);
      expect(Object.keys(columns)).toContain("id");
      for (const [field, attribute] of Object.entries(definition.fields)) {
        const column = columns[attribute.fieldName ?? field];
        expect(column, `${getTableName(table as Table)} lacks ${field}`).toBeDefined();
        expect(column?.notNull, `${field} nullability`).toBe(attribute.required !== false);
      }
    });
  }
});

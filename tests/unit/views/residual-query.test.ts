import { describe, expect, it } from "vitest";
import { pageCount, residualQuerySchema, residualSearchParams, sortFromTable } from "@/lib/views/residual-query";

// The residual table's sorting state → the residuals route's query string (sorted on the server).

describe("residual query", () => {
  it("sorts by model energy both ways, '-' in front for descending", () => {
    const ascending = residualQuerySchema.parse({ page: 2, ...sortFromTable([{ id: "modelEnergy", desc: false }]) });
    expect(residualSearchParams(ascending).toString()).toBe("page=2&pageSize=25&sort=modelEnergy");
    const descending = residualQuerySchema.parse({ band: 3, ...sortFromTable([{ id: "modelEnergy", desc: true }]) });
    expect(residualSearchParams(descending).toString()).toBe("band=3&page=1&pageSize=25&sort=-modelEnergy");
  });

  it("|Residual| descending is sort=-absResidual; an unknown column falls back to point order", () => {
    expect(sortFromTable([{ id: "absResidual", desc: true }])).toEqual({ sort: "absResidual", descending: true });
    expect(sortFromTable([{ id: "weightedResidual", desc: true }])).toEqual({ sort: "pointIndex", descending: false });
    expect(sortFromTable([])).toEqual({ sort: "pointIndex", descending: false });
  });

  it("counts pages, at least one", () => {
    expect(pageCount(0, 25)).toBe(1);
    expect(pageCount(120, 25)).toBe(5);
    expect(pageCount(125, 25)).toBe(5);
  });
});

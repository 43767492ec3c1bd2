import { describe, expect, it } from "vitest";
import type { PageChange } from "@/lib/domain/revisions/compare";
import { followPage } from "@/lib/domain/revisions/follow";

const change = (status: PageChange["status"], oldPage: number | null, newPage: number | null): PageChange =>
  ({ status, oldPage, newPage, similarity: status === "unchanged" ? 1 : 0.6 }) as PageChange;

describe("following a page to a later revision", () => {
  it("goes where the content moved, says when it changed or went", () => {
    const rev2 = [
      change("unchanged", 1, 1),
      change("added", null, 2),
      change("moved", 2, 3),
      change("changed", 3, 4),
      change("removed", 4, null),
    ];
    const rev3 = [change("unchanged", 1, 1), change("unchanged", 2, 2), change("unchanged", 3, 3), change("moved", 4, 6)];
    expect(followPage([rev2], 1)).toEqual({ page: 1, status: "unchanged" });
    expect(followPage([rev2], 2)).toEqual({ page: 3, status: "moved" });
    expect(followPage([rev2, rev3], 3)).toEqual({ page: 6, status: "changed" }); // changed in rev 2, then moved to 6: still "changed"
    expect(followPage([rev2], 4)).toEqual({ page: null, status: "removed" });
    expect(followPage([], 7)).toEqual({ page: 7, status: "unchanged" });
    // A page the comparison does not list is not claimed unchanged.
    expect(followPage([[]], 9)).toEqual({ page: 9, status: "changed" });
  });
});

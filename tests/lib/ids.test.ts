import { describe, expect, test } from "vitest";
import { isRecordId } from "@/lib/ids";

describe("isRecordId", () => {
  test.each(["0f8fad5b-d9cb-469f-a165-70867728950e", "7C9E6679-7425-40DE-944B-E07FC1F90AE7", "00000000-0000-0000-0000-000000000000"])(
    "takes %s",
    (id) => {
      expect(isRecordId(id)).toBe(true);
    },
  );

  test.each([
    "",
    "abc",
    "0f8fad5b-d9cb-469f-a165-70867728950",
    "0f8fad5b-d9cb-469f-a165-70867728950e ",
    "../0f8fad5b-d9cb-469f-a165-70867728950e",
    "0f8fad5bd9cb469fa16570867728950e",
    undefined,
    42,
    null,
  ])("refuses %j", (id) => {
    expect(isRecordId(id)).toBe(false);
  });
});

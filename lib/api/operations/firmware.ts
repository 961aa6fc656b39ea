import { defineOperation, fileResponse } from "../operation";
import { idParams } from "./account";

export const downloadBuildVectors = defineOperation({
  id: "downloadBuildVectors",
  method: "GET",
  path: "/api/v1/builds/{id}/vectors",
  summary: "Firmware test vectors of the build's stored bank image: stored codes, duty codes over a temperature sweep and per-tick transient traces (docs/firmware-vectors.md), as a JSON download",
  tag: "Builds",
  access: "read",
  params: idParams,
  response: fileResponse(["application/json"], "The vectors file (format loopkeeper-firmware-vectors)"),
});

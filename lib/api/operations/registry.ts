import { z } from "zod";
import { defineOperation } from "../operation";
import { idParams } from "./account";
import {
  boardModelBody,
  boardModelView,
  boardRevisionBody,
  boardRevisionView,
  componentBody,
  componentView,
  coolerModelBody,
  coolerModelView,
  listQuery,
  pageOf,
} from "./registry-schemas";
import { compatibilityView } from "./profile-schemas";
import { ALL_COMPONENTS, ALL_COOLERS } from "../limits";

export const componentSorts = ["name", "kind", "maxRpm", "minDutyPct", "refSoundDbA"] as const;
export const componentsQuery = listQuery(componentSorts).extend({ kind: z.enum(["fan", "pump"]).optional() });
export type ComponentsQuery = z.infer<typeof componentsQuery>;

export const listComponents = defineOperation({
  id: "listComponents",
  method: "GET",
  path: "/api/v1/components",
  summary: "Fans and pumps, sorted, filtered and paged",
  tag: "Registry",
  access: "read",
  query: componentsQuery,
  response: pageOf(componentView),
});

export const createComponent = defineOperation({
  id: "createComponent",
  method: "POST",
  path: "/api/v1/components",
  summary: "Add a fan or pump model",
  tag: "Registry",
  access: "registry:write",
  body: componentBody,
  response: z.object({ component: componentView }),
  successStatus: 201,
});

export const updateComponent = defineOperation({
  id: "updateComponent",
  method: "PUT",
  path: "/api/v1/components/{id}",
  summary: "Replace a fan or pump model's figures",
  tag: "Registry",
  access: "registry:write",
  params: idParams,
  body: componentBody,
  response: z.object({ component: componentView }),
});

export { ALL_COMPONENTS, ALL_COOLERS };

export const coolerSorts = ["name", "radiatorMm", "fanCount"] as const;
export const coolerModelsQuery = listQuery(coolerSorts);
export type CoolerModelsQuery = z.infer<typeof coolerModelsQuery>;


export const listCoolerModels = defineOperation({
  id: "listCoolerModels",
  method: "GET",
  path: "/api/v1/cooler-models",
  summary: "Cooler models with their parts, sorted, filtered and paged",
  tag: "Registry",
  access: "read",
  query: coolerModelsQuery,
  response: pageOf(coolerModelView),
});

export const createCoolerModel = defineOperation({
  id: "createCoolerModel",
  method: "POST",
  path: "/api/v1/cooler-models",
  summary: "Add a cooler model",
  tag: "Registry",
  access: "registry:write",
  body: coolerModelBody,
  response: z.object({ coolerModel: coolerModelView }),
  successStatus: 201,
});

export const updateCoolerModel = defineOperation({
  id: "updateCoolerModel",
  method: "PUT",
  path: "/api/v1/cooler-models/{id}",
  summary: "Replace a cooler model's parts and radiator figures (its board model is fixed once profiles exist)",
  tag: "Registry",
  access: "registry:write",
  params: idParams,
  body: coolerModelBody,
  response: z.object({ coolerModel: coolerModelView }),
});

export const listBoardModels = defineOperation({
  id: "listBoardModels",
  method: "GET",
  path: "/api/v1/board-models",
  summary: "Board models with their revisions",
  tag: "Registry",
  access: "read",
  response: z.object({ items: z.array(boardModelView) }),
});

export const createBoardModel = defineOperation({
  id: "createBoardModel",
  method: "POST",
  path: "/api/v1/board-models",
  summary: "Add a board model",
  tag: "Registry",
  access: "registry:write",
  body: boardModelBody,
  response: z.object({ boardModel: boardModelView }),
  successStatus: 201,
});

export const updateBoardModel = defineOperation({
  id: "updateBoardModel",
  method: "PUT",
  path: "/api/v1/board-models/{id}",
  summary: "Rename or describe a board model (its serial prefix is fixed once production lots exist)",
  tag: "Registry",
  access: "registry:write",
  params: idParams,
  body: boardModelBody,
  response: z.object({ boardModel: boardModelView }),
});

export const createBoardRevision = defineOperation({
  id: "createBoardRevision",
  method: "POST",
  path: "/api/v1/board-models/{id}/revisions",
  summary: "Add a revision to a board model",
  tag: "Registry",
  access: "registry:write",
  params: idParams,
  body: boardRevisionBody,
  response: z.object({ revision: boardRevisionView }),
  successStatus: 201,
});

export const signingKeyView = z.object({ keyId: z.string(), publicKeyPem: z.string(), validFrom: z.string(), validUntil: z.string().nullable() });

export const listBoardSigningKeys = defineOperation({
  id: "listBoardSigningKeys",
  method: "GET",
  path: "/api/v1/board-models/{id}/signing-keys",
  summary: "The Ed25519 public keys a board model's bank signatures verify with, and when each was in use (rotated keys stay listed)",
  tag: "Registry",
  access: "read",
  params: idParams,
  response: z.object({ keys: z.array(signingKeyView) }),
});

export const getBoardRevision = defineOperation({
  id: "getBoardRevision",
  method: "GET",
  path: "/api/v1/board-revisions/{id}",
  summary: "A board revision, its limits, and every profile version checked against it and its siblings",
  tag: "Registry",
  access: "read",
  params: idParams,
  response: z.object({ revision: boardRevisionView, boardModelName: z.string(), compatibility: compatibilityView }),
});
export const updateBoardRevision = defineOperation({
  id: "updateBoardRevision",
  method: "PUT",
  path: "/api/v1/board-revisions/{id}",
  summary: "Correct a board revision's limits (only its notes once production lots of it exist)",
  tag: "Registry",
  access: "registry:write",
  params: idParams,
  body: boardRevisionBody,
  response: z.object({ revision: boardRevisionView }),
});

export type BoardRevisionDetail = z.infer<typeof getBoardRevision.response>;

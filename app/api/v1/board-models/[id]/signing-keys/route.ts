import { apiRoute } from "@/lib/platform/http/api-route";
import { listBoardSigningKeys } from "@/lib/api/operations/registry";
import { getDb } from "@/db/client";
import { listBankSigningKeys } from "@/db/bank-signatures";

export const GET = apiRoute(listBoardSigningKeys, async ({ params }) => ({
  keys: (await listBankSigningKeys(getDb(), { boardModelId: params.id })).map((k) => ({ keyId: k.keyId, publicKeyPem: k.publicKeyPem, validFrom: k.validFrom.toISOString(), validUntil: k.validUntil?.toISOString() ?? null })),
}));

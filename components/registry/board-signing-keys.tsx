"use client";

import { useQuery } from "@tanstack/react-query";
import { apiQuery } from "@/lib/api/client";
import { listBoardSigningKeys } from "@/lib/api/endpoints";

/** The board model's bank-signing public keys, so the factory and support can verify images offline. */
export function BoardSigningKeys({ boardModelId, boardName }: { boardModelId: string; boardName: string }) {
  const q = useQuery(apiQuery(listBoardSigningKeys, { params: { id: boardModelId } }));
  if (!q.data) return null;
  return (
    <div className="mt-3 text-sm" data-testid="signing-keys">
      <h3 className="font-medium text-ink-800">Bank signing keys of {boardName}</h3>
      {q.data.keys.length === 0 ? (
        <p className="text-ink-600">None yet: the first build to enter pilot signs its bank and registers the key.</p>
      ) : (
        <ul className="mt-1 space-y-2">
          {q.data.keys.map((k) => (
            <li key={k.keyId}>
              Key <code className="text-xs">{k.keyId}</code>, valid from {new Date(k.validFrom).toISOString().slice(0, 10)}
              {k.validUntil ? ` until ${new Date(k.validUntil).toISOString().slice(0, 10)} (rotated; older images still verify with it)` : " (current)"}
              <details>
                <summary className="cursor-pointer text-copper-700">Public key (PEM, for loopkeeper verify)</summary>
                <pre className="mt-1 overflow-x-auto rounded bg-ink-50 p-2 text-xs">{k.publicKeyPem}</pre>
              </details>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

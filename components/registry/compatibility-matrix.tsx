import Link from "next/link";
import type { CompatibilityView } from "@/lib/api/operations/profile-schemas";
import { Table, Td, Th } from "@/components/ui/table";

/** Profile versions × board revisions; every "no" says why. */
export function CompatibilityMatrix({ data, highlightRevisionId }: { data: CompatibilityView; highlightRevisionId?: string }) {
  return (
    <Table caption="Compatibility of profile versions with board revisions">
      <thead>
        <tr>
          <Th>Profile version</Th>
          <Th>Range · image</Th>
          {data.revisions.map((r) => (
            <Th key={r.id} className={r.id === highlightRevisionId ? "bg-copper-50" : ""}>
              {r.revision} <span className="font-normal normal-case">({r.memoryBytes} B)</span>
            </Th>
          ))}
        </tr>
      </thead>
      <tbody>
        {data.rows.map((row) => (
          <tr key={row.versionId}>
            <Td>
              <Link className="text-copper-700 underline" href={`/profiles/${row.profileId}`}>
                {row.coolerModelName} · {row.profileName}
              </Link>{" "}
              <span className="tabular-nums">{row.version}</span>
            </Td>
            <Td className="whitespace-nowrap text-xs">
              <code>{row.boardRange}</code> · {row.encodedBytes} B
            </Td>
            {row.cells.map((c) => (
              <Td key={c.revisionId} className={c.revisionId === highlightRevisionId ? "bg-copper-50/50" : ""}>
                {c.ok ? (
                  <span className="font-medium text-signal-ok">yes</span>
                ) : (
                  <span className="text-xs">
                    <span className="font-medium text-signal-fault">no</span> — {c.reasons.join(" ")}
                  </span>
                )}
              </Td>
            ))}
          </tr>
        ))}
      </tbody>
    </Table>
  );
}

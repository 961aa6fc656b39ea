import Link from "next/link";
import { hex32 } from "@/lib/hex/address";
import type { VersionView } from "@/lib/api/operations/profile-schemas";
import { EmptyRow, Table, Td, Th } from "@/components/ui/table";

/** Published versions, newest first, with download and compare links. */
export function VersionHistory({ profileId, versions }: { profileId: string; versions: VersionView[] }) {
  return (
    <Table caption="Published versions">
      <thead>
        <tr>
          <Th>Version</Th>
          <Th>Range</Th>
          <Th>Image</Th>
          <Th>Changelog</Th>
          <Th>By, when (UTC)</Th>
          <Th />
        </tr>
      </thead>
      <tbody>
        {versions.length === 0 && <EmptyRow colSpan={6}>Nothing published yet.</EmptyRow>}
        {versions.map((v, i) => {
          const previous = versions[i + 1];
          return (
            <tr key={v.id}>
              <Td className="font-medium tabular-nums">{v.version}</Td>
              <Td><code className="text-xs">{v.boardRange}</code></Td>
              <Td className="whitespace-nowrap text-xs tabular-nums">{v.encodedBytes} B · CRC {hex32(v.crc32)}</Td>
              <Td>{v.changelog}</Td>
              <Td className="whitespace-nowrap text-xs">{v.authorName} · {v.createdAt.slice(0, 16).replace("T", " ")}</Td>
              <Td className="whitespace-nowrap text-sm">
                <a className="text-copper-700 underline" href={`/api/v1/profile-versions/${v.id}/download`} download>
                  Download<span className="sr-only"> {v.version}</span>
                </a>
                {previous && (
                  <>
                    {" · "}
                    <Link className="text-copper-700 underline" href={`/profiles/${profileId}/compare?a=${previous.id}&b=${v.id}`}>
                      Compare with {previous.version}
                    </Link>
                  </>
                )}
              </Td>
            </tr>
          );
        })}
      </tbody>
    </Table>
  );
}

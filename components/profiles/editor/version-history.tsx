"use client";

import Link from "next/link";
import { useEffect } from "react";
import { hex32 } from "@/lib/hex/address";
import type { VersionView } from "@/lib/api/operations/profile-schemas";
import { EmptyRow, Table, Td, Th } from "@/components/ui/table";
import { formatUtc } from "@/lib/time/format";

/** Published versions, newest first, with download and compare links. */
export function VersionHistory({ profileId, versions }: { profileId: string; versions: VersionView[] }) {
  // Links to one version (from builds, the audit log) name it in the fragment; the rows arrive after the page, so bring it into view here.
  useEffect(() => {
    const id = decodeURIComponent(window.location.hash.slice(1));
    if (id.startsWith("version-")) document.getElementById(id)?.scrollIntoView({ block: "center" });
  }, [versions.length]);
  return (
    <Table caption="Published versions">
      <thead>
        <tr>
          <Th>Version</Th>
          <Th>Range</Th>
          <Th>Image</Th>
          <Th>Changelog</Th>
          <Th>By, when</Th>
          <Th />
        </tr>
      </thead>
      <tbody>
        {versions.length === 0 && <EmptyRow colSpan={6}>Nothing published yet.</EmptyRow>}
        {versions.map((v, i) => {
          const previous = versions[i + 1];
          return (
            <tr key={v.id} id={`version-${v.version}`} className="target:bg-copper-50">
              <Td className="font-medium tabular-nums">{v.version}</Td>
              <Td><code className="text-xs">{v.boardRange}</code></Td>
              <Td className="whitespace-nowrap text-xs tabular-nums">{v.encodedBytes} B · CRC {hex32(v.crc32)}</Td>
              <Td>{v.changelog}</Td>
              <Td className="whitespace-nowrap text-xs">{v.authorName} · {formatUtc(v.createdAt)}</Td>
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

import { fitToRevisions } from "@/lib/release/bank-fit";
import { isValidRange, satisfiesRange } from "@/lib/versioning/semver-helpers";
import { Table, Td, Th } from "@/components/ui/table";

/**
 * The bank the chosen slots make against each revision's profile memory and slot count, before
 * the build is created (the server checks the same when it encodes the bank).
 */
export function BankFit({ bankBytes, slots, revisionRange, revisions }: { bankBytes: number; slots: number; revisionRange: string; revisions: { revision: string; memoryBytes: number; slotCount: number }[] }) {
  const rangeOk = revisionRange.trim() !== "" && isValidRange(revisionRange);
  const rows = fitToRevisions(bankBytes, slots, revisions);
  return (
    <section aria-labelledby="bank-fit-title" data-testid="bank-fit">
      <h3 id="bank-fit-title" className="text-sm font-medium text-ink-800">Bank size against each revision</h3>
      <p className="mb-1 text-xs text-ink-600">
        {slots === 0 ? "Pick profile versions to see the bank's size." : `The bank takes ${bankBytes.toLocaleString("en")} bytes in ${slots} slot${slots === 1 ? "" : "s"}.`}
        {!rangeOk && " Give the board revisions to see which ones the build is for."}
      </p>
      <Table caption="Bank size against each revision's profile memory">
        <thead>
          <tr>
            <Th>Revision</Th>
            <Th>In the build&apos;s range</Th>
            <Th>Profile memory</Th>
            <Th>Slots</Th>
            <Th>Fits</Th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => {
            const inRange = rangeOk && satisfiesRange(r.revision, revisionRange);
            const fits = r.fitsMemory && r.fitsSlots;
            return (
              <tr key={r.revision} className={rangeOk && !inRange ? "text-ink-500" : ""}>
                <Td className="tabular-nums">{r.revision}</Td>
                <Td>{rangeOk ? (inRange ? "yes" : "no") : "—"}</Td>
                <Td className="tabular-nums">{r.memoryBytes.toLocaleString("en")} B</Td>
                <Td className="tabular-nums">{r.slotCount}</Td>
                <Td className={slots > 0 && !fits && inRange ? "font-medium text-signal-fault" : ""}>
                  {slots === 0
                    ? "—"
                    : fits
                      ? `yes, ${r.spareBytes.toLocaleString("en")} B spare`
                      : [!r.fitsMemory && `no: ${(-r.spareBytes).toLocaleString("en")} B too large`, !r.fitsSlots && `no: ${slots} slots, it holds ${r.slotCount}`].filter(Boolean).join("; ")}
                </Td>
              </tr>
            );
          })}
        </tbody>
      </Table>
    </section>
  );
}

// Slot for the coach's markup in the printable set report. Markup (components/markup) is built on another
// branch; the lead wires it here, so the report keeps one clearly named place for it.
export function PrintMarkupSlot({ setId }: { setId: string }) {
  return <section data-slot="print-markup" data-set-id={setId} className="break-inside-avoid" />;
}

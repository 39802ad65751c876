"use client";
// Opens the browser's print dialog (save as PDF from there).
import { Button } from "@/components/ui/button";

export function PrintButton() {
  return (
    <Button variant="secondary" onClick={() => window.print()} className="print:hidden">
      Print or save as PDF
    </Button>
  );
}

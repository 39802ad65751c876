"use client";
// "Analyse again" under a result: opens the analysis step on demand (it fetches the clip only then);
// the new analysis replaces the old one when it is saved.
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { AnalysisStep, type AnalysisStepProps } from "./analysis-step";

export function Reanalyse(props: AnalysisStepProps) {
  const [open, setOpen] = useState(false);
  if (!open) {
    return (
      <div>
        <Button variant="secondary" onClick={() => setOpen(true)}>
          Analyse again
        </Button>
      </div>
    );
  }
  return (
    <Card>
      <CardHeader title="Analyse again" description="The new result replaces this one once it is saved." />
      <CardBody>
        <AnalysisStep {...props} onSaved={() => setOpen(false)} />
      </CardBody>
    </Card>
  );
}

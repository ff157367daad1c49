"use client";

import type { AnalysisResult } from "@/modules/calc";
import { UnitsProvider, UnitsSwitch, type UnitSystem } from "@/app/_components/workspace/units-context";
import { ChecksTable, CrossCheckTable, ImpedanceTable, MassTable, ModesTable, ResponseTable } from "@/app/_components/workspace/results-tables";
import { ResponsePlots } from "@/app/_components/workspace/response-plots";
import { SpeedRampResults } from "@/app/_components/workspace/speed-ramps-section";

/** The stored result of a revision, shown with the workspace's own tables and plots (read-only). */
export function RevisionResults({ result, units }: { result: AnalysisResult; units: UnitSystem }) {
  return (
    <UnitsProvider initial={units}>
      <div className="space-y-5" data-testid="revision-results">
        <div className="flex justify-end">
          <UnitsSwitch />
        </div>
        <section className="slab space-y-2 p-4">
          <h3>Checks</h3>
          <ChecksTable result={result} />
        </section>
        <section className="slab space-y-2 p-4">
          <h3>Mass and block</h3>
          <MassTable result={result} />
        </section>
        <section className="slab space-y-2 p-4">
          <h3>Soil springs and damping</h3>
          <ImpedanceTable result={result} />
        </section>
        <section className="slab space-y-2 p-4">
          <h3>Natural frequencies</h3>
          <ModesTable result={result} />
        </section>
        <section className="slab space-y-2 p-4">
          <h3>Amplitudes at rated speed</h3>
          <ResponseTable result={result} />
        </section>
        <section className="slab space-y-2 p-4">
          <h3>Frequency response</h3>
          <ResponsePlots result={result} />
        </section>
        {result.transient?.length ? (
          <section className="slab space-y-2 p-4" data-testid="revision-speed-ramps">
            <h3>Speed ramps through resonance</h3>
            <SpeedRampResults result={result} />
          </section>
        ) : null}
        <section className="slab space-y-2 p-4">
          <h3>Hand-calculation cross-check</h3>
          <CrossCheckTable result={result} />
        </section>
      </div>
    </UnitsProvider>
  );
}

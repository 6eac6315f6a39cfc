const CAUTIONS: Record<string, string> = {
  mains: "connects to mains: lethal voltages are present on the live side, including after unplugging where capacitors hold charge",
  "high-voltage": "works at high voltage: discharge capacitors before touching and keep creepage and clearance distances",
  "high-current": "carries high current: size conductors, fuses and connectors for the fault current, not only the working one",
  heat: "runs hot: parts and heatsinks can burn, and a failed part can start a fire; allow for airflow and derating",
};

/** Shown on every block that can hurt someone; the checks here prove a circuit, not an installation. */
export function HazardCaution({ hazard }: { hazard: string[] }) {
  if (!hazard?.length) return null;
  return (
    <aside role="note" aria-label="Safety cautions" className="rounded border-2 border-ochre bg-[#fff7e6] px-4 py-3 text-sm" data-testid="hazard">
      <p className="font-semibold">Caution: this block can hurt people.</p>
      <ul className="mt-1 list-disc pl-5">
        {hazard.map((h) => <li key={h}>It {CAUTIONS[h] ?? `is marked "${h}"`}.</li>)}
      </ul>
      <p className="mt-1">
        Passing checks do not make a build safe. Follow your local electrical codes and safety standards, and have mains
        and high-voltage work done or inspected by a licensed, qualified person.
      </p>
    </aside>
  );
}

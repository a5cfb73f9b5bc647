// The port-stay plan as a mixed-integer programme (CPLEX LP text, read by HiGHS): the exact optimum
// of the same value the heuristic maximises, under the same rules, so that tests can measure the
// heuristic against it (server/planning/optimum.test.ts).
//
//   x[j,p]   = 1 when job j starts at the p-th working slot (it then takes the next `need` ones);
//   y[j,p,i] = 1 when person i is on job j started at p.
// maximise Σ value_j x[j,p] subject to
//   Σ_p x[j,p] ≤ 1                                         each job at most once;
//   Σ_{i of rank r} y[j,p,i] = count_r(j) x[j,p]            its team, the same people throughout;
//   Σ_{(j,p) covering t} y[j,p,i] ≤ 1                       a person does one job at a time;
//   Σ_{(j,p)} |slots(j,p) ∩ w| y[j,p,i] ≤ max(0, L − watch_i(w))   every rest window w of every rule.
// People on a watch during a start's slots get no y for it. Exact for small and medium stays; the
// model grows with jobs × starts × people, so the product keeps the heuristic.
import { buildCrewLedger } from "./crew-ledger";
import { classify, valueOf, type Classified } from "./job-classes";
import { boundsOf } from "./job-placement";
import { buildStayGrid, slotsFor } from "./stay-grid";
import { horizonOf, type StayPlanInput } from "./stay-planner";

export type ExactModel = { lp: string; considered: Classified[]; variables: number };

type Start = { name: string; slots: number[]; people: { i: number; name: string }[] };

/** Writes terms a few to a line: the LP reader takes long expressions over several lines. */
function sum(terms: string[]): string {
  const lines: string[] = [];
  for (let k = 0; k < terms.length; k += 8) lines.push(terms.slice(k, k + 8).join(" + "));
  return lines.join("\n   + ");
}

export function exactModel(input: StayPlanInput): ExactModel {
  const { stay } = input;
  const grid = buildStayGrid(stay.arrivesAt, stay.departsAt, stay.timeZone, stay.workday, input.slotMinutes);
  const { considered } = classify(input.jobs, { departsAt: stay.departsAt, horizon: horizonOf(input) });
  const ledger = buildCrewLedger(grid, stay.crew, stay.watches);
  const n = grid.slots.length;

  const objective: string[] = [];
  const rows: string[] = [];
  const binaries: string[] = [];
  // Per person: the y variables and the slots each covers.
  const byPerson = ledger.persons.map(() => [] as { name: string; slots: number[] }[]);

  considered.forEach((c, j) => {
    const bounds = boundsOf(c.job, grid, stay);
    const need = slotsFor(c.job.elapsedHours, grid);
    const starts: Start[] = [];
    grid.workable.forEach((first, p) => {
      const slots = grid.workable.slice(p, p + need);
      if (slots.length < need || first < bounds.lo || slots[need - 1]! >= bounds.hi) return;
      const people = ledger.persons
        .map((person, i) => ({ person, i }))
        .filter(({ person, i }) => c.job.team.some((t) => t.rank === person.rank) && slots.every((t) => ledger.watch[i]![t] === 0))
        .map(({ i }) => ({ i, name: `y_${j}_${p}_${i}` }));
      const enough = c.job.team.every((t) => people.filter(({ i }) => ledger.persons[i]!.rank === t.rank).length >= t.count);
      if (enough) starts.push({ name: `x_${j}_${p}`, slots, people });
    });
    if (starts.length === 0) return;
    rows.push(`one_${j}: ${sum(starts.map((s) => s.name))} <= 1`);
    for (const s of starts) {
      objective.push(`${valueOf(c)} ${s.name}`);
      binaries.push(s.name, ...s.people.map((p) => p.name));
      c.job.team.forEach((t, r) => {
        const ys = s.people.filter(({ i }) => ledger.persons[i]!.rank === t.rank).map((p) => p.name);
        rows.push(`team_${s.name}_${r}: ${sum(ys)} - ${t.count} ${s.name} = 0`);
      });
      for (const p of s.people) byPerson[p.i]!.push({ name: p.name, slots: s.slots });
    }
  });

  byPerson.forEach((ys, i) => {
    if (ys.length === 0) return;
    for (let t = 0; t < n; t++) {
      const covering = ys.filter((y) => y.slots.includes(t)).map((y) => y.name);
      if (covering.length > 1) rows.push(`busy_${i}_${t}: ${sum(covering)} <= 1`);
    }
    ledger.rules.forEach(([window, most], r) => {
      for (let end = 0; end < n + window - 1; end++) {
        const from = end - window + 1;
        const inWindow = (t: number) => t >= from && t <= end;
        let watch = 0;
        for (let t = Math.max(0, from); t <= Math.min(n - 1, end); t++) watch += ledger.watch[i]![t]!;
        const terms = ys
          .map((y) => ({ name: y.name, k: y.slots.filter(inWindow).length }))
          .filter((y) => y.k > 0);
        const reach = terms.reduce((a, y) => a + y.k, 0);
        if (reach + watch <= most) continue; // cannot bind
        rows.push(`rest_${i}_${r}_${end}: ${sum(terms.map((y) => `${y.k} ${y.name}`))} <= ${Math.max(0, most - watch)}`);
      }
    });
  });

  const lp = [
    "Maximize",
    ` value: ${objective.length ? sum(objective) : "0 x_none"}`,
    "Subject To",
    ...rows.map((row) => ` ${row}`),
    ...(objective.length ? [] : [" none: x_none <= 0"]),
    "Binary",
    ` ${binaries.length ? binaries.join("\n ") : "x_none"}`,
    "End",
  ].join("\n");
  return { lp, considered, variables: binaries.length };
}

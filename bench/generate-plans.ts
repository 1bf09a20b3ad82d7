// Generates a registry of plan files for benchmarks: varied kinds, surfaces and options, all valid.
const SURFACES = ['checkout/payment', 'checkout/review', 'basket/summary', 'search/results', 'search/suggestions', 'home/feed', 'account/settings', 'delivery/slot-picker'];
const KINDS = ['proportion', 'mean', 'ratio'] as const;

function metricYaml(name: string, kind: (typeof KINDS)[number], indent: string, extra: string[] = []): string {
  const baseline =
    kind === 'proportion'
      ? 'baseline: { rate: 0.12 }'
      : kind === 'mean'
        ? 'baseline: { mean: 42.5, sd: 30 }'
        : 'baseline:\n' + `${indent}  numerator: { mean: 0.9, sd: 1.4 }\n${indent}  denominator: { mean: 3.2, sd: 2.5 }\n${indent}  correlation: 0.5`;
  return [`name: ${name}`, `kind: ${kind}`, baseline, `events: [${name.replace(/-/g, '_')}_done, page_viewed]`, ...extra].join(`\n${indent}`);
}

export function generatePlanText(i: number): string {
  const kind = KINDS[i % 3]!;
  const day = String(1 + (i % 28)).padStart(2, '0');
  return `# yaml-language-server: $schema=../schema/plan.schema.json
id: bench-plan-${i}
title: "Benchmark plan number ${i}"
owners: ["@owner-${i % 37}", "@team-${i % 11}"]
flags: [bench-flag-${i}]
state: ${['draft', 'live', 'on-hold', 'concluded'][i % 4]}
window: { start: 2026-11-${day}, end: 2026-12-${day} }
hypothesis:
  change: Change number ${i} to the ${SURFACES[i % SURFACES.length]} surface.
  because: Users told us in research round ${i % 9} that this step is confusing.
  expected-direction: increase
unit: { randomization: ${i % 5 === 0 ? 'team' : 'user'} }
surface:
  path: ${SURFACES[i % SURFACES.length]}/part-${i % 13}
  overlaps-with: [bench-plan-${i + 1}]
population:
  platforms: [web, ios, android]
  locales: [en-GB, pt-BR]
  ready: { platforms: [web, ios, android], locales: [en-GB, pt-BR] }
exposure: { event: bench_${i}_exposed, reach: 0.${5 + (i % 5)} }
metrics:
  primary:
    ${metricYaml(`primary-${i}`, kind, '    ')}
  guardrails:
    - ${metricYaml(`latency-${i}`, 'mean', '      ', ['direction: decrease', 'tolerance: { relative: 0.02 }'])}
    - ${metricYaml(`errors-${i}`, 'proportion', '      ', ['direction: decrease', 'tolerance: { absolute: 0.002 }'])}
  secondary:
    - ${metricYaml(`depth-${i}`, KINDS[(i + 1) % 3]!, '      ')}
design:
  arms:
    - { name: control, weight: 50 }
    - { name: treatment, weight: 50 }
  alpha: 0.05
  power: 0.8
  min-detectable-effect: { relative: 0.0${1 + (i % 8)} }
  daily-units: ${1000 + i * 7}
  interim-looks: ${i % 4}
  pre-period-correlation: 0.4
${i % 5 === 0 ? '  cluster: { mean-size: 6, icc: 0.05 }\n' : ''}decisions:
  win: Ship it to everyone.
  flat: Remove the change.
  loss: Remove the change and investigate.
  guardrail-breach: Stop at once.
`;
}

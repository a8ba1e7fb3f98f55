// Benchmark figures for the reverberant test scenes (test/helpers/reverbScenes: hall, courtyard, corridor, shallow water):
// per scene the share of sounds inside the array's hull fixed within 1 m, median errors (m), coverage of the 95 %
// ellipses, median Mahalanobis² (chi-square median 1.386 for 2 dof), verdict counts and the time to render and locate.
import { locatedVerdict } from '../core/pipeline';
import { median } from '../core/locate';
import { locateReverbScene, reverbScenes, scoreReverbScene, type ReverbOutcome } from '../test/helpers/reverbScenes';

// chi-square quantile, 2 dof, 95 %: 5.991465 (statistical tables; ../shared/check-values.md).
const CHI2_2DOF_95 = 5.991465;

function percent(share: number): string {
  return `${(100 * share).toFixed(1)} %`;
}

function ellipseFigures(list: readonly ReverbOutcome[]): string {
  const fixed = list.filter((o) => Number.isFinite(o.mahalanobis2));
  if (fixed.length === 0) return 'no fixes';
  const covered = fixed.filter((o) => o.mahalanobis2 <= CHI2_2DOF_95).length / fixed.length;
  return `coverage ${percent(covered)} of ${fixed.length}, median M² ${median(fixed.map((o) => o.mahalanobis2)).toFixed(2)}`;
}

console.log('reverb: reverberant scenes, 2-D at the known source height (render + locate in this process)');
const all: ReverbOutcome[] = [];
for (const scene of reverbScenes()) {
  const started = process.hrtime.bigint();
  const { run, outcomes } = await locateReverbScene(scene);
  const seconds = Number(process.hrtime.bigint() - started) / 1e9;
  all.push(...outcomes);
  const score = scoreReverbScene(scene.name, outcomes);
  const grades = { firm: 0, doubtful: 0, unusable: 0 };
  for (const located of run.result.located) grades[locatedVerdict(located, run.geometry).grade]++;
  console.log(
    `  ${scene.name.padEnd(13)} ${score.sounds} sounds (${score.insideHull} inside): within 1 m inside ${percent(score.within1mInsideHull)}, ` +
      `median error inside ${score.medianErrorInsideMeters.toFixed(3)} m, all ${score.medianErrorAllMeters.toFixed(3)} m; ` +
      `${ellipseFigures(outcomes)}; inside the hull ${ellipseFigures(outcomes.filter((o) => o.insideHull))}; ` +
      `verdicts ${grades.firm} firm, ${grades.doubtful} doubtful, ${grades.unusable} unusable; ${seconds.toFixed(1)} s`,
  );
}
console.log(`  all scenes: ${ellipseFigures(all)}; inside the hull ${ellipseFigures(all.filter((o) => o.insideHull))}`);

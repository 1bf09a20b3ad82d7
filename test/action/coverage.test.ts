import { describe, expect, it } from 'vitest';
import { coverageNotice } from '../../src/core/report/coverage-notice.js';
import type { Review } from '../../src/core/review/build-review.js';
import { withUnseenFiles } from '../../src/core/review/coverage.js';

/** A review with only what the partial marking reads. */
const reviewWith = (verdict: Review['verdict']) => ({ verdict, counts: { block: 0, warn: 0, note: 0 }, findings: [] }) as unknown as Review;
const unseen = { reason: 'GitHub lists at most 3,000 files of a pull request', reviewedFiles: 3000, changedFiles: 4250 };

describe('a review over files it never saw', () => {
  it.each([
    ['clear', 'partial'],
    ['nothing-to-check', 'partial'],
    ['warnings', 'warnings'],
    ['blocked', 'blocked'],
  ] as const)('turns %s into %s, and says so in the notice', (before, after) => {
    const review = withUnseenFiles(reviewWith(before), unseen);
    expect(review.verdict).toBe(after);
    expect(coverageNotice(review).join('\n')).toContain('**Partial review.** GitHub lists at most 3,000 files of a pull request: this review read 3,000 files; 1,250 of its 4,250 changed files were not reviewed');
  });

  it('says nothing about coverage when every file was seen', () => {
    expect(coverageNotice(reviewWith('clear'))).toEqual([]);
  });
});

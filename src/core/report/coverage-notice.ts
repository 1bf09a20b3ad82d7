import type { Review } from '../review/build-review.js';
import { formatCount } from './numbers.js';

/**
 * The lines that say a review is partial, for the comment and the summary: shown right under the
 * verdict, since a reader must not take silence about unseen files for an all-clear.
 */
export function coverageNotice(review: Review): string[] {
  const unseen = review.partial;
  if (!unseen) return [];
  const missed = unseen.changedFiles !== undefined && unseen.changedFiles > unseen.reviewedFiles ? `; ${formatCount(unseen.changedFiles - unseen.reviewedFiles)} of its ${formatCount(unseen.changedFiles)} changed files were not reviewed` : '; the files past them were not reviewed';
  return [`> **Partial review.** ${unseen.reason}: this review read ${formatCount(unseen.reviewedFiles)} files${missed}, so it cannot say the change is clear.`, ''];
}

import type { Review } from './build-review.js';

/** What a review could not see: files of the change that were never listed to it. */
export interface UnseenFiles {
  /** Why some files went unseen, in words for the reader. */
  reason: string;
  /** Files the review read. */
  reviewedFiles: number;
  /** Files the change has, when known (the pull request's own count); more than reviewedFiles. */
  changedFiles?: number;
}

/**
 * Marks a review as partial. A review that found nothing cannot say "all clear" (or "nothing to
 * check") over files it never saw, so those verdicts become `partial`; blocked and warnings stay,
 * since what was found holds either way, and carry the same note.
 */
export function withUnseenFiles(review: Review, unseen: UnseenFiles): Review {
  const verdict = review.verdict === 'clear' || review.verdict === 'nothing-to-check' ? 'partial' : review.verdict;
  return { ...review, verdict, partial: unseen };
}

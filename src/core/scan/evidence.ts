/**
 * What a file can say about the product. Only product code logs an event or reads a flag; a test, a fixture,
 * a document or a generated file that quotes a name only mentions it. This keeps "logged" honest: a
 * tracking-plan page or a test that still quotes a deleted event must not count as the event being logged.
 */
export type EvidenceKind = 'code' | 'test' | 'docs' | 'generated';

const TEST_FOLDER = /(?:^|\/)(?:test|tests|__tests__|spec|specs|e2e|fixtures?|__fixtures__|testdata|test-data|__mocks__|mocks?|stories|__snapshots__)\//i;
const TEST_FILE = /(?:\.(?:test|spec|stories|e2e|cy)\.[^/]+$|_test\.(?:go|py|rb|exs?)$|(?:^|\/)test_[^/]+\.py$|(?:Tests?|Spec|IT)\.(?:java|kt|cs|swift|scala)$|\.snap$)/;
const DOCS = /(?:(?:^|\/)(?:docs?|documentation)\/|\.(?:md|mdx|markdown|rst|adoc|txt|html?)$)/i;
const GENERATED = /(?:(?:^|\/)(?:generated|__generated__|gen|dist|build|out|vendor)\/|\.(?:generated|gen|g|pb|min)\.[^/]+$|\.lock$|-lock\.json$)/i;

export function evidenceKindOf(path: string): EvidenceKind {
  if (TEST_FOLDER.test(path) || TEST_FILE.test(path)) return 'test';
  if (GENERATED.test(path)) return 'generated';
  if (DOCS.test(path)) return 'docs';
  return 'code';
}

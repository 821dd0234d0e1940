/** One problem found in a model document: where (a dotted path into the document) and what. */
export interface ModelIssue {
  /** e.g. "hoppings.3.to" or "parameters" */
  path: string;
  message: string;
}

/** Thrown when a model document, template request or parameter vector is invalid; lists every issue found. */
export class ModelError extends Error {
  readonly issues: ModelIssue[];

  constructor(issues: ModelIssue[]) {
    super(issues.map((i) => (i.path ? `${i.path}: ${i.message}` : i.message)).join("; "));
    this.name = "ModelError";
    this.issues = issues;
  }
}

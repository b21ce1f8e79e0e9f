/**
 * A reply that is a file, not JSON (exports: CSV, BibTeX, PDF, a JSON download): the router
 * sends it with its content type and as an attachment named `filename`.
 */
export class FileReply {
  constructor(
    readonly contentType: string,
    readonly filename: string,
    readonly body: Buffer | string,
  ) {}
}

/**
 * A stored file sent as a download (always as an attachment, with nosniff): the router streams it
 * instead of sending JSON (evidence files).
 */
export class FileReply {
  constructor(
    readonly path: string,
    readonly name: string,
    readonly mediaType: string,
    readonly size: number,
  ) {}
}

/**
 * A file made for this reply, not JSON (exports: CSV, BibTeX, PDF, a JSON download): the router
 * sends it with its content type and as an attachment named `filename`.
 */
export class FileDownload {
  constructor(
    readonly contentType: string,
    readonly filename: string,
    readonly body: Buffer | string,
  ) {}
}

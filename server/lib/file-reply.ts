/**
 * A file sent as a download (always as an attachment, with nosniff): the router streams it
 * instead of sending JSON.
 */
export class FileReply {
  constructor(
    readonly path: string,
    readonly name: string,
    readonly mediaType: string,
    readonly size: number,
  ) {}
}

/**
 * A reply body that is already JSON text (serialised off the request thread by the calculation
 * worker). The router sends it as it is; outside production it still parses it against the
 * route's reply schema, like every other reply.
 */
export class RawJson {
  constructor(readonly text: string) {}
}

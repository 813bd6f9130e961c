// A JSON answer already written out (e.g. from prepared documents), to be sent as it is: the same
// bytes res.json would send for the value it stands for. `T` is that value's type, so a route
// still cannot answer with a body its schema does not describe.
export class PreparedJson<T> {
  declare readonly value: T;
  constructor(readonly text: string) {}
}

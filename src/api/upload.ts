// Multipart uploads with progress. openapi-fetch (fetch) cannot report upload progress, so file
// uploads go through XMLHttpRequest, whose `upload.onprogress` can; answers and problems are
// handled exactly as `unwrap` handles them.
import { CONSOLE_CLIENT_HEADER } from './client.ts';
import { ApiProblem, NETWORK_PROBLEM, problemFromResponse } from './problem.ts';
import type { paths } from './schema';

/** The paths whose POST takes multipart/form-data, read from the generated API types. */
export type MultipartPath = {
  [P in keyof paths]: paths[P] extends { post: { requestBody: { content: { 'multipart/form-data': unknown } } } } ? P : never;
}[keyof paths];

type Json<R> = R extends { content: { 'application/json': infer T } } ? T : never;
type Responses<P extends MultipartPath> = paths[P] extends { post: { responses: infer R } } ? R : never;

/** What a successful multipart POST to P answers: its 200 and 201 JSON bodies. */
export type MultipartAnswer<P extends MultipartPath> =
  Json<Responses<P>[200 & keyof Responses<P>]> | Json<Responses<P>[201 & keyof Responses<P>]>;

export interface UploadProgress {
  /** Bytes of the request body sent so far. */
  loaded: number;
  /** Bytes of the whole body, when the browser knows it. */
  total: number | null;
}

export interface UploadAnswer<T> {
  status: number;
  data: T;
}

function parseJson(text: string): unknown {
  try {
    return text ? JSON.parse(text) : undefined;
  } catch {
    return undefined;
  }
}

/** POSTs `form` to `/api/v1<path>`; resolves with the status and JSON body, or rejects with an ApiProblem. */
export function postMultipart<P extends MultipartPath, T extends MultipartAnswer<P> = MultipartAnswer<P>>(
  path: P,
  form: FormData,
  onProgress?: (progress: UploadProgress) => void,
): Promise<UploadAnswer<T>> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/v1${path}`);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.setRequestHeader(...CONSOLE_CLIENT_HEADER);
    xhr.upload.onprogress = (event) => onProgress?.({ loaded: event.loaded, total: event.lengthComputable ? event.total : null });
    xhr.onload = () => {
      const body = parseJson(xhr.responseText);
      if (xhr.status >= 200 && xhr.status < 300) resolve({ status: xhr.status, data: body as T });
      else reject(problemFromResponse(xhr.status, xhr.statusText, body));
    };
    xhr.onerror = () => reject(new ApiProblem(NETWORK_PROBLEM));
    xhr.onabort = () => reject(new ApiProblem({ ...NETWORK_PROBLEM, title: 'The upload was cancelled', detail: undefined }));
    xhr.send(form);
  });
}

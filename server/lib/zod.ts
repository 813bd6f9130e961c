// zod with the `.openapi()` extension. Every schema file imports `z` from here so that
// one schema both validates a request and documents it.
import { extendZodWithOpenApi } from '@asteasolutions/zod-to-openapi';
import { z } from 'zod';

extendZodWithOpenApi(z);

export { z };

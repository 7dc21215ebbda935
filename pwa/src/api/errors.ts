/** The one error shape the Panelpass API answers with. */
export interface ApiErrorBody {
  statusCode: number;
  code: string;
  message: string;
  details?: unknown;
}

/** The server answered, and said no. */
export class ApiError extends Error {
  override readonly name = 'ApiError';
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
  }
}

/**
 * No answer from the server: no signal, a timeout, or the server is down. The session is
 * kept; the same call can be tried again later.
 */
export class NetworkError extends Error {
  override readonly name = 'NetworkError';
  constructor(message = 'No connection to the Panelpass server', options?: { cause?: unknown }) {
    super(message, options);
  }
}

export function isApiError(error: unknown, status?: number): error is ApiError {
  return error instanceof ApiError && (status === undefined || error.status === status);
}

export function isNetworkError(error: unknown): error is NetworkError {
  return error instanceof NetworkError;
}

function isErrorBody(value: unknown): value is ApiErrorBody {
  if (typeof value !== 'object' || value === null) return false;
  const body = value as Record<string, unknown>;
  return typeof body.code === 'string' && typeof body.message === 'string';
}

/** Turns a failed response into an ApiError, also when its body is not our JSON shape. */
export async function toApiError(response: Response): Promise<ApiError> {
  let body: unknown = null;
  try {
    body = await response.json();
  } catch {
    // A proxy's HTML page or an empty body: fall back to the status alone.
  }
  if (isErrorBody(body)) {
    return new ApiError(response.status, body.code, body.message, body.details);
  }
  return new ApiError(
    response.status,
    `http-${response.status}`,
    response.statusText || `HTTP ${response.status}`,
  );
}

import { apiClient } from '../../../app/services';
import { signUp, type SignUpInput } from '../api/authApi';
import { useStartSession } from './useStartSession';

const request = (input: SignUpInput) => signUp(apiClient, input);

/** Starts a new business with its owner, and signs the owner in. */
export function useSignUp() {
  return useStartSession(request);
}

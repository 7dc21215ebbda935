import { apiClient } from '../../../app/services';
import { signIn, type SignInInput } from '../api/authApi';
import { useStartSession } from './useStartSession';

const request = (input: SignInInput) => signIn(apiClient, input);

export function useSignIn() {
  return useStartSession(request);
}

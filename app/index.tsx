import { Redirect } from 'expo-router';

import { useSession } from '../src/api/session';
import { SignInForm } from '../src/components/auth';

export default function SignInRoute() {
  const session = useSession();
  if (session.data?.user) return <Redirect href="/sites" />;
  return <SignInForm />;
}

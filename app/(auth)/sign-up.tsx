import { Redirect } from 'expo-router';

import { useSession } from '../../src/api/session';
import { SignUpForm } from '../../src/components/auth';

export default function SignUpRoute() {
  const session = useSession();
  if (session.data?.user) return <Redirect href="/sites" />;
  return <SignUpForm />;
}

import { IonPage } from '@ionic/react';
import { useEffect, useState } from 'react';
import { Link } from 'react-router-dom';
import { BrandHeader } from '../components/BrandHeader';
import { SignInForm } from '../features/auth/components/SignInForm';
import { useSignIn } from '../features/auth/hooks/useSignIn';
import { authErrorMessage } from '../features/auth/model/authMessages';
import { clearSignInNote, readSignInNote } from '../features/auth/model/signInNote';
import { Notice } from '../components/Notice';
import { startBusinessPath } from '../features/shell/model/access';

export default function SignInPage() {
  const signIn = useSignIn();
  // A word left for this screen (the business was deleted): shown once, then let go.
  const [note] = useState(readSignInNote);
  useEffect(() => clearSignInNote(), []);
  return (
    <IonPage>
      {/* A plain scrolling body (.pp-content), as on the tab pages: this is a first screen. */}
      <main className="pp-content">
        <div className="pp-auth">
          <BrandHeader
            title="Sign in"
            lead="Today's cars, panels and timers — with or without signal."
          />
          {note ? <Notice tone="done">{note}</Notice> : null}
          <SignInForm
            onSubmit={(input) => signIn.start(input)}
            pending={signIn.pending}
            error={signIn.error ? authErrorMessage('sign-in', signIn.error) : null}
          />
          <p className="pp-auth__switch">
            New to Panelpass?{' '}
            <Link className="pp-link" to={startBusinessPath}>
              Start a new business
            </Link>
          </p>
        </div>
      </main>
    </IonPage>
  );
}

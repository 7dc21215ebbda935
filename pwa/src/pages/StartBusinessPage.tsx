import { IonPage } from '@ionic/react';
import { IonContent } from '../components/ionic';
import { Link } from 'react-router-dom';
import { BrandHeader } from '../components/BrandHeader';
import { SignUpForm } from '../features/auth/components/SignUpForm';
import { useSignUp } from '../features/auth/hooks/useSignUp';
import { authErrorMessage } from '../features/auth/model/authMessages';
import { signInPath } from '../features/shell/model/access';

export default function StartBusinessPage() {
  const signUp = useSignUp();
  return (
    <IonPage>
      <IonContent>
        <div className="pp-auth">
          <BrandHeader
            title="Start a new business"
            lead="You will be its owner. You can invite helpers afterwards."
          />
          <SignUpForm
            onSubmit={(input) => signUp.start(input)}
            pending={signUp.pending}
            error={signUp.error ? authErrorMessage('sign-up', signUp.error) : null}
          />
          <p className="pp-auth__switch">
            Already on Panelpass?{' '}
            <Link className="pp-link" to={signInPath}>
              Sign in
            </Link>
          </p>
        </div>
      </IonContent>
    </IonPage>
  );
}

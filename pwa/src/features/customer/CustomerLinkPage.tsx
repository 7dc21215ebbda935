import './customer.css';
import { CustomerLinkScreen } from './components/CustomerLinkScreen';

/** The page behind `/c/:token`, outside the tab shell. */
export default function CustomerLinkPage() {
  return <CustomerLinkScreen />;
}

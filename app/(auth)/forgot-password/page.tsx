import Link from 'next/link';
import type { Metadata } from 'next';
import { AuthCard } from '../auth-card';
import { ForgotPasswordForm } from './forgot-password-form';

export const metadata: Metadata = { title: 'Reset your password' };

export default function ForgotPasswordPage() {
  return (
    <AuthCard
      title="Reset your password"
      intro="Enter the address you sign in with. If it has an account, we send it a link to choose a new password."
      footer={
        <Link href="/sign-in" className="text-ledger-700 underline-offset-2 hover:underline">
          Back to sign in
        </Link>
      }
    >
      <ForgotPasswordForm />
    </AuthCard>
  );
}

'use client';

import { useState } from 'react';
import { Button } from '@/components/ui/button';

type Status = { kind: 'idle' } | { kind: 'asking' } | { kind: 'done'; accuracyM: number } | { kind: 'error'; message: string };

// What the browser's GeolocationPositionError codes mean for the person at the form (W3C Geolocation API §6).
const REFUSED = 1;
const UNAVAILABLE = 2;
const TIMEOUT = 3;

export function geolocationErrorText(code: number): string {
  if (code === REFUSED) return 'Location was refused. Allow location for this site in the browser settings, or type the coordinates.';
  if (code === UNAVAILABLE) return 'The device could not find its position (no GPS fix or network location). Try again outdoors, or type the coordinates.';
  if (code === TIMEOUT) return 'Finding the position took too long. Try again, or type the coordinates.';
  return 'The position could not be read. Type the coordinates instead.';
}

/**
 * Fills latitude and longitude from the browser's position (standing at the site with a phone).
 * The figures go into the fields for the installer to check before saving; nothing is sent anywhere
 * else. Six decimals are about 0.1 m, finer than any phone fix.
 */
export function UseMyLocation({ onPosition }: { onPosition: (latDeg: string, lonDeg: string) => void }) {
  const [status, setStatus] = useState<Status>({ kind: 'idle' });
  const locate = () => {
    if (typeof navigator === 'undefined' || !('geolocation' in navigator)) {
      setStatus({ kind: 'error', message: 'This browser cannot share its location. Type the coordinates.' });
      return;
    }
    setStatus({ kind: 'asking' });
    navigator.geolocation.getCurrentPosition(
      (pos) => {
        onPosition(pos.coords.latitude.toFixed(6), pos.coords.longitude.toFixed(6));
        setStatus({ kind: 'done', accuracyM: pos.coords.accuracy });
      },
      (err) => setStatus({ kind: 'error', message: geolocationErrorText(err.code) }),
      { enableHighAccuracy: true, timeout: 20_000, maximumAge: 60_000 },
    );
  };
  return (
    <div className="flex flex-wrap items-center gap-3 sm:col-span-2 lg:col-span-3">
      <Button type="button" variant="secondary" size="sm" onClick={locate} disabled={status.kind === 'asking'}>
        {status.kind === 'asking' ? 'Finding your position…' : 'Use my location'}
      </Button>
      <p className={`text-xs ${status.kind === 'error' ? 'text-amber-800' : 'text-stone-600'}`} role="status" aria-live="polite">
        {status.kind === 'idle' && 'Standing at the site? Fill the coordinates from this device.'}
        {status.kind === 'done' && `Filled from this device, accurate to about ${Math.max(1, Math.round(status.accuracyM))} m. Check them before saving.`}
        {status.kind === 'error' && status.message}
      </p>
    </div>
  );
}

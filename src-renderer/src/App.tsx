import { useEffect, useState } from 'react';
import type { ResponseOf } from '@shared/model/contract';
import { call } from './api/client';
import { Cautions } from './components/Cautions';

type Loaded = ResponseOf<'loadDemo'>;

export function App() {
  const [info, setInfo] = useState<ResponseOf<'appInfo'> | null>(null);
  const [plan, setPlan] = useState<Loaded | null>(null);
  const [error, setError] = useState<string | null>(null);

  useEffect(() => {
    let live = true;
    Promise.all([call('appInfo', {}), call('loadDemo', { which: 'continuous' })])
      .then(([appInfo, demo]) => {
        if (!live) return;
        setInfo(appInfo);
        setPlan(demo);
      })
      .catch((e: unknown) => live && setError(e instanceof Error ? e.message : String(e)));
    return () => {
      live = false;
    };
  }, []);

  return (
    <div className="app">
      <header className="app-header">
        <h1>Plumbline</h1>
        {info && <span className="muted">version {info.version}</span>}
      </header>
      <Cautions />
      <main>
        {error && (
          <p role="alert" className="error">
            {error}
          </p>
        )}
        {plan && (
          <section aria-labelledby="plan-title">
            <h2 id="plan-title">{plan.project.name}</h2>
            <ul>
              {plan.project.populations.map((p) => (
                <li key={p.id}>{p.name}</li>
              ))}
            </ul>
          </section>
        )}
      </main>
    </div>
  );
}

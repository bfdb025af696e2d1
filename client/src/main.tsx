import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
// Noto Sans ships with the app: regular, semibold, bold. Nothing is fetched from elsewhere.
import '@fontsource/noto-sans/400.css';
import '@fontsource/noto-sans/600.css';
import '@fontsource/noto-sans/700.css';
import './styles.css';
import { App } from './app/app';

const root = document.getElementById('root');
if (!root) throw new Error('Missing #root element in index.html');

createRoot(root).render(
  <StrictMode>
    <App />
  </StrictMode>,
);

// Renderer entry: mounts the React workspace.
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './App';
import './styles.css';

const rootElement = document.getElementById('root');
if (rootElement === null) throw new Error('The page has no #root element.');
createRoot(rootElement).render(
  <StrictMode>
    <App />
  </StrictMode>,
);

import { render } from 'preact';
import { App } from './ui/App';
import './ui/styles.css';
import './ui/day.css';

const root = document.getElementById('app');
if (root) render(<App />, root);

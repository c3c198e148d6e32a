import { Component, type ReactNode } from 'react';

// Around a lazily loaded 3D view: without WebGL (or if the view fails) the page's lists still do the job,
// so the view is replaced by a note saying so and the rest of the island carries on.

export class SceneBoundary extends Component<{ fallback: ReactNode; children: ReactNode }, { failed: boolean }> {
  state = { failed: false };
  static getDerivedStateFromError() {
    return { failed: true };
  }
  render() {
    return this.state.failed ? this.props.fallback : this.props.children;
  }
}

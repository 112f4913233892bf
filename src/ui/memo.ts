// A component that re-renders only when its props change by the given test: for parts a parent
// re-renders often with the same inputs. Preact's own memo lives in preact/compat, which brings
// React's compatibility layer and its global hooks; this is the same idea on a plain Component.
import { Component, h, type ComponentType, type FunctionComponent } from 'preact';

export function memoWith<P extends object>(
  view: FunctionComponent<P>,
  same: (before: P, after: P) => boolean,
): ComponentType<P> {
  class Memo extends Component<P> {
    static override displayName = `Memo(${view.name})`;
    override shouldComponentUpdate(next: P): boolean {
      return !same(this.props, next);
    }
    render(props: P) {
      return h(view, props);
    }
  }
  return Memo;
}

// Keeping one's place on the case page (used by PlaceKeeper.razor).
// - A navigation started in the checklist (a click on an item, a key in the list) keeps the page where it is: Blazor scrolls
//   to the top after every navigation to a new address, so its one scrollTo(0, 0) that follows is skipped.
// - Every address remembers its scroll position (sessionStorage); back and forward put it back.
// - After a key move or a navigation by address, the selected row is scrolled into view and its link takes the focus.
const storeKey = 'eventreview.scroll:';
const here = () => location.pathname + location.search;
let keepUntil = 0;
let restoreTo = null;

const scrollToNative = window.scrollTo.bind(window);
window.scrollTo = function (...args) {
    if (performance.now() < keepUntil && args.length === 2 && args[0] === 0 && args[1] === 0) {
        keepUntil = 0;
        return;
    }
    return scrollToNative(...args);
};

const keepPlace = () => { keepUntil = performance.now() + 3000; };
document.addEventListener('click', e => {
    if (e.target instanceof Element && e.target.closest('.checklist-column a')) keepPlace();
}, true);
document.addEventListener('keydown', e => {
    if (e.target instanceof Element && e.target.closest('.checklist-column')) keepPlace();
}, true);

let pending = false;
const remember = () => {
    try { sessionStorage.setItem(storeKey + here(), String(Math.round(window.scrollY))); } catch { /* storage off */ }
};
window.addEventListener('scroll', () => {
    if (!pending) {
        pending = true;
        requestAnimationFrame(() => { pending = false; remember(); });
    }
}, { passive: true });

// Read before Blazor renders the page of the address gone back (or forward) to.
window.addEventListener('popstate', () => {
    let saved = null;
    try { saved = sessionStorage.getItem(storeKey + here()); } catch { /* storage off */ }
    restoreTo = saved === null ? null : Number(saved);
    keepPlace();
});

/**
 * Called after the case page has drawn a new address. how: "click" (from the list: stay), "keyboard" (a key in the list),
 * "address" (arrived by a link, a reload or from another tab).
 */
export function settle(itemKey, how, attempt = 0) {
    keepUntil = 0;
    if (restoreTo !== null) {
        scrollToNative(0, restoreTo);
        restoreTo = null;
        remember();
        return;
    }

    const row = itemKey ? document.querySelector(`li[data-item="${CSS.escape(itemKey)}"]`) : null;
    if (itemKey && !row && attempt < 20) {
        // The checklist tab draws its panel a moment after the page: look again shortly.
        setTimeout(() => settle(itemKey, how, attempt + 1), 100);
        return;
    }
    if (row && (how === 'keyboard' || how === 'address')) {
        const r = row.getBoundingClientRect();
        if (r.top < 64 || r.bottom > window.innerHeight) {
            row.scrollIntoView({ block: how === 'keyboard' ? 'nearest' : 'center' });
        }
        const link = row.querySelector('a');
        const active = document.activeElement;
        if (link && (how === 'keyboard' || !active || active === document.body || active.tagName === 'H1')) {
            link.focus({ preventScroll: true });
        }
    }
    remember();
}

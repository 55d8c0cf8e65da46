// The editing toolbar every map editor uses (field boundaries, treatment zones): polygons and rectangles
// only, and no self-crossing edges, which the server would refuse anyway.
import '@geoman-io/leaflet-geoman-free';
import '@geoman-io/leaflet-geoman-free/dist/leaflet-geoman.css';
import type L from 'leaflet';

// The toolbar's tools and prompts in our own plain words (the buttons are named when they are made, so this comes first).
export const editingWords = {
  buttonTitles: {
    drawPolyButton: 'Draw a shape corner by corner',
    drawRectButton: 'Draw a rectangle',
    editButton: 'Move corners',
    dragButton: 'Move a whole shape',
    cutButton: 'Cut a hole',
    deleteButton: 'Remove a shape',
  },
  tooltips: {
    firstVertex: 'Click where the shape starts',
    continueLine: 'Click to add the next corner',
    finishPoly: 'Click the first corner to close the shape',
    finishRect: 'Click the opposite corner',
  },
  actions: { finish: 'Done', cancel: 'Stop drawing', removeLastVertex: 'Undo the last corner' },
};

export function addPolygonEditing(map: L.Map, options: { cutPolygon: boolean }) {
  map.pm.setLang('en', editingWords, 'en');
  map.pm.addControls({
    position: 'topleft',
    drawMarker: false,
    drawCircleMarker: false,
    drawPolyline: false,
    drawCircle: false,
    drawText: false,
    drawRectangle: true,
    drawPolygon: true,
    editMode: true,
    dragMode: true,
    cutPolygon: options.cutPolygon,
    rotateMode: false,
    removalMode: true,
  });
  map.pm.setGlobalOptions({ allowSelfIntersection: false, snappable: true });
  nameToolbarButtons(map);
}

// Geoman puts each tool's name only in the title of the button's container; screen readers need it on the button.
function nameToolbarButtons(map: L.Map) {
  map
    .getContainer()
    .querySelectorAll<HTMLElement>('.button-container[title] > .leaflet-buttons-control-button')
    .forEach((button) => {
      button.setAttribute('aria-label', button.parentElement?.getAttribute('title') ?? '');
    });
}

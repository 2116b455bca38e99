import L from 'leaflet';
import markerIcon2xUrl from 'leaflet/dist/images/marker-icon-2x.png';
import markerIconUrl from 'leaflet/dist/images/marker-icon.png';
import markerShadowUrl from 'leaflet/dist/images/marker-shadow.png';
import './map.css';

/**
 * Leaflet finds its default marker images by reading a CSS path, which breaks once Vite hashes
 * the files (docs/architecture.md, "Library notes"). Point it at the bundled images instead; imported once by the map wrapper.
 */
L.Icon.Default.mergeOptions({ iconUrl: markerIconUrl, iconRetinaUrl: markerIcon2xUrl, shadowUrl: markerShadowUrl });

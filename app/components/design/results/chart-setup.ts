// chart.js is tree-shaken: register only the scales, elements and plugins the result charts use, once, when the
// first chart's chunk loads (not in the entry every page loads). The Line and Bar controllers are registered by
// vue-chartjs's typed components themselves.
import { BarElement, Chart, Legend, LinearScale, LineElement, LogarithmicScale, PointElement, Tooltip } from 'chart.js'

Chart.register(LinearScale, LogarithmicScale, LineElement, PointElement, BarElement, Tooltip, Legend)
// Static charts: no animation (faster, and stable screenshots).
Chart.defaults.animation = false
Chart.defaults.font.family = 'Roboto, system-ui, sans-serif'
Chart.defaults.color = '#475569'


import type { DefineComponent, SlotsType } from 'vue'
type IslandComponent<T> = DefineComponent<{}, {refresh: () => Promise<void>}, {}, {}, {}, {}, {}, {}, {}, {}, {}, {}, SlotsType<{ fallback: { error: unknown } }>> & T

type HydrationStrategies = {
  hydrateOnVisible?: IntersectionObserverInit | true
  hydrateOnIdle?: number | true
  hydrateOnInteraction?: keyof HTMLElementEventMap | Array<keyof HTMLElementEventMap> | true
  hydrateOnMediaQuery?: string
  hydrateAfter?: number
  hydrateWhen?: boolean
  hydrateNever?: true
}
type LazyComponent<T> = DefineComponent<HydrationStrategies, {}, {}, {}, {}, {}, {}, { hydrated: () => void }> & T


export const FormField: typeof import("../app/components/FormField.vue")['default']
export const BomLinesTable: typeof import("../app/components/bom/BomLinesTable.vue")['default']
export const BomStatusBadge: typeof import("../app/components/bom/BomStatusBadge.vue")['default']
export const ApprovalBadge: typeof import("../app/components/catalog/ApprovalBadge.vue")['default']
export const CatalogPagination: typeof import("../app/components/catalog/CatalogPagination.vue")['default']
export const ImportMapping: typeof import("../app/components/catalog/ImportMapping.vue")['default']
export const ImportPreview: typeof import("../app/components/catalog/ImportPreview.vue")['default']
export const ImportProblems: typeof import("../app/components/catalog/ImportProblems.vue")['default']
export const ImportUpload: typeof import("../app/components/catalog/ImportUpload.vue")['default']
export const ImportWorkspace: typeof import("../app/components/catalog/ImportWorkspace.vue")['default']
export const LifecycleBadge: typeof import("../app/components/catalog/LifecycleBadge.vue")['default']
export const PartEditForm: typeof import("../app/components/catalog/PartEditForm.vue")['default']
export const PartFieldGroups: typeof import("../app/components/catalog/PartFieldGroups.vue")['default']
export const PartVersionHistory: typeof import("../app/components/catalog/PartVersionHistory.vue")['default']
export const PartsTable: typeof import("../app/components/catalog/PartsTable.vue")['default']
export const DesignWorkspace: typeof import("../app/components/design/DesignWorkspace.vue")['default']
export const ConverterFields: typeof import("../app/components/design/form/ConverterFields.vue")['default']
export const DeratingFields: typeof import("../app/components/design/form/DeratingFields.vue")['default']
export const DesignForm: typeof import("../app/components/design/form/DesignForm.vue")['default']
export const OperatingPointsEditor: typeof import("../app/components/design/form/OperatingPointsEditor.vue")['default']
export const QuantityInput: typeof import("../app/components/design/form/QuantityInput.vue")['default']
export const TopologyIcon: typeof import("../app/components/design/form/TopologyIcon.vue")['default']
export const TopologyPicker: typeof import("../app/components/design/form/TopologyPicker.vue")['default']
export const LegSchematic: typeof import("../app/components/design/results/LegSchematic.vue")['default']
export const ProvenanceHint: typeof import("../app/components/design/results/ProvenanceHint.vue")['default']
export const ResultsCapacitorTable: typeof import("../app/components/design/results/ResultsCapacitorTable.vue")['default']
export const ResultsCounts: typeof import("../app/components/design/results/ResultsCounts.vue")['default']
export const ResultsDeviceTable: typeof import("../app/components/design/results/ResultsDeviceTable.vue")['default']
export const ResultsPanel: typeof import("../app/components/design/results/ResultsPanel.vue")['default']
export const ResultsWarnings: typeof import("../app/components/design/results/ResultsWarnings.vue")['default']
export const SpectrumChart: typeof import("../app/components/design/results/SpectrumChart.vue")['default']
export const WaveformChart: typeof import("../app/components/design/results/WaveformChart.vue")['default']
export const TradeStudyChart: typeof import("../app/components/trade/TradeStudyChart.vue")['default']
export const DataTable: typeof import("../app/components/ui/DataTable.vue")['default']
export const AuthState: typeof import("../node_modules/nuxt-auth-utils/dist/runtime/app/components/AuthState.vue")['default']
export const NuxtWelcome: typeof import("../node_modules/nuxt/dist/app/components/welcome.vue")['default']
export const NuxtLayout: typeof import("../node_modules/nuxt/dist/app/components/nuxt-layout")['default']
export const NuxtErrorBoundary: typeof import("../node_modules/nuxt/dist/app/components/nuxt-error-boundary.vue")['default']
export const ClientOnly: typeof import("../node_modules/nuxt/dist/app/components/client-only")['default']
export const DevOnly: typeof import("../node_modules/nuxt/dist/app/components/dev-only")['default']
export const ServerPlaceholder: typeof import("../node_modules/nuxt/dist/app/components/server-placeholder")['default']
export const NuxtLink: typeof import("../node_modules/nuxt/dist/app/components/nuxt-link")['default']
export const NuxtLoadingIndicator: typeof import("../node_modules/nuxt/dist/app/components/nuxt-loading-indicator")['default']
export const NuxtTime: typeof import("../node_modules/nuxt/dist/app/components/nuxt-time.vue")['default']
export const NuxtRouteAnnouncer: typeof import("../node_modules/nuxt/dist/app/components/nuxt-route-announcer")['default']
export const NuxtAnnouncer: typeof import("../node_modules/nuxt/dist/app/components/nuxt-announcer")['default']
export const NuxtImg: typeof import("../node_modules/nuxt/dist/app/components/nuxt-stubs")['NuxtImg']
export const NuxtPicture: typeof import("../node_modules/nuxt/dist/app/components/nuxt-stubs")['NuxtPicture']
export const NuxtPage: typeof import("../node_modules/nuxt/dist/pages/runtime/page")['default']
export const NoScript: typeof import("../node_modules/nuxt/dist/head/runtime/components")['NoScript']
export const Link: typeof import("../node_modules/nuxt/dist/head/runtime/components")['Link']
export const Base: typeof import("../node_modules/nuxt/dist/head/runtime/components")['Base']
export const Title: typeof import("../node_modules/nuxt/dist/head/runtime/components")['Title']
export const Meta: typeof import("../node_modules/nuxt/dist/head/runtime/components")['Meta']
export const Style: typeof import("../node_modules/nuxt/dist/head/runtime/components")['Style']
export const Head: typeof import("../node_modules/nuxt/dist/head/runtime/components")['Head']
export const Html: typeof import("../node_modules/nuxt/dist/head/runtime/components")['Html']
export const Body: typeof import("../node_modules/nuxt/dist/head/runtime/components")['Body']
export const NuxtIsland: typeof import("../node_modules/nuxt/dist/app/components/nuxt-island")['default']
export const LazyFormField: LazyComponent<typeof import("../app/components/FormField.vue")['default']>
export const LazyBomLinesTable: LazyComponent<typeof import("../app/components/bom/BomLinesTable.vue")['default']>
export const LazyBomStatusBadge: LazyComponent<typeof import("../app/components/bom/BomStatusBadge.vue")['default']>
export const LazyApprovalBadge: LazyComponent<typeof import("../app/components/catalog/ApprovalBadge.vue")['default']>
export const LazyCatalogPagination: LazyComponent<typeof import("../app/components/catalog/CatalogPagination.vue")['default']>
export const LazyImportMapping: LazyComponent<typeof import("../app/components/catalog/ImportMapping.vue")['default']>
export const LazyImportPreview: LazyComponent<typeof import("../app/components/catalog/ImportPreview.vue")['default']>
export const LazyImportProblems: LazyComponent<typeof import("../app/components/catalog/ImportProblems.vue")['default']>
export const LazyImportUpload: LazyComponent<typeof import("../app/components/catalog/ImportUpload.vue")['default']>
export const LazyImportWorkspace: LazyComponent<typeof import("../app/components/catalog/ImportWorkspace.vue")['default']>
export const LazyLifecycleBadge: LazyComponent<typeof import("../app/components/catalog/LifecycleBadge.vue")['default']>
export const LazyPartEditForm: LazyComponent<typeof import("../app/components/catalog/PartEditForm.vue")['default']>
export const LazyPartFieldGroups: LazyComponent<typeof import("../app/components/catalog/PartFieldGroups.vue")['default']>
export const LazyPartVersionHistory: LazyComponent<typeof import("../app/components/catalog/PartVersionHistory.vue")['default']>
export const LazyPartsTable: LazyComponent<typeof import("../app/components/catalog/PartsTable.vue")['default']>
export const LazyDesignWorkspace: LazyComponent<typeof import("../app/components/design/DesignWorkspace.vue")['default']>
export const LazyConverterFields: LazyComponent<typeof import("../app/components/design/form/ConverterFields.vue")['default']>
export const LazyDeratingFields: LazyComponent<typeof import("../app/components/design/form/DeratingFields.vue")['default']>
export const LazyDesignForm: LazyComponent<typeof import("../app/components/design/form/DesignForm.vue")['default']>
export const LazyOperatingPointsEditor: LazyComponent<typeof import("../app/components/design/form/OperatingPointsEditor.vue")['default']>
export const LazyQuantityInput: LazyComponent<typeof import("../app/components/design/form/QuantityInput.vue")['default']>
export const LazyTopologyIcon: LazyComponent<typeof import("../app/components/design/form/TopologyIcon.vue")['default']>
export const LazyTopologyPicker: LazyComponent<typeof import("../app/components/design/form/TopologyPicker.vue")['default']>
export const LazyLegSchematic: LazyComponent<typeof import("../app/components/design/results/LegSchematic.vue")['default']>
export const LazyProvenanceHint: LazyComponent<typeof import("../app/components/design/results/ProvenanceHint.vue")['default']>
export const LazyResultsCapacitorTable: LazyComponent<typeof import("../app/components/design/results/ResultsCapacitorTable.vue")['default']>
export const LazyResultsCounts: LazyComponent<typeof import("../app/components/design/results/ResultsCounts.vue")['default']>
export const LazyResultsDeviceTable: LazyComponent<typeof import("../app/components/design/results/ResultsDeviceTable.vue")['default']>
export const LazyResultsPanel: LazyComponent<typeof import("../app/components/design/results/ResultsPanel.vue")['default']>
export const LazyResultsWarnings: LazyComponent<typeof import("../app/components/design/results/ResultsWarnings.vue")['default']>
export const LazySpectrumChart: LazyComponent<typeof import("../app/components/design/results/SpectrumChart.vue")['default']>
export const LazyWaveformChart: LazyComponent<typeof import("../app/components/design/results/WaveformChart.vue")['default']>
export const LazyTradeStudyChart: LazyComponent<typeof import("../app/components/trade/TradeStudyChart.vue")['default']>
export const LazyDataTable: LazyComponent<typeof import("../app/components/ui/DataTable.vue")['default']>
export const LazyAuthState: LazyComponent<typeof import("../node_modules/nuxt-auth-utils/dist/runtime/app/components/AuthState.vue")['default']>
export const LazyNuxtWelcome: LazyComponent<typeof import("../node_modules/nuxt/dist/app/components/welcome.vue")['default']>
export const LazyNuxtLayout: LazyComponent<typeof import("../node_modules/nuxt/dist/app/components/nuxt-layout")['default']>
export const LazyNuxtErrorBoundary: LazyComponent<typeof import("../node_modules/nuxt/dist/app/components/nuxt-error-boundary.vue")['default']>
export const LazyClientOnly: LazyComponent<typeof import("../node_modules/nuxt/dist/app/components/client-only")['default']>
export const LazyDevOnly: LazyComponent<typeof import("../node_modules/nuxt/dist/app/components/dev-only")['default']>
export const LazyServerPlaceholder: LazyComponent<typeof import("../node_modules/nuxt/dist/app/components/server-placeholder")['default']>
export const LazyNuxtLink: LazyComponent<typeof import("../node_modules/nuxt/dist/app/components/nuxt-link")['default']>
export const LazyNuxtLoadingIndicator: LazyComponent<typeof import("../node_modules/nuxt/dist/app/components/nuxt-loading-indicator")['default']>
export const LazyNuxtTime: LazyComponent<typeof import("../node_modules/nuxt/dist/app/components/nuxt-time.vue")['default']>
export const LazyNuxtRouteAnnouncer: LazyComponent<typeof import("../node_modules/nuxt/dist/app/components/nuxt-route-announcer")['default']>
export const LazyNuxtAnnouncer: LazyComponent<typeof import("../node_modules/nuxt/dist/app/components/nuxt-announcer")['default']>
export const LazyNuxtImg: LazyComponent<typeof import("../node_modules/nuxt/dist/app/components/nuxt-stubs")['NuxtImg']>
export const LazyNuxtPicture: LazyComponent<typeof import("../node_modules/nuxt/dist/app/components/nuxt-stubs")['NuxtPicture']>
export const LazyNuxtPage: LazyComponent<typeof import("../node_modules/nuxt/dist/pages/runtime/page")['default']>
export const LazyNoScript: LazyComponent<typeof import("../node_modules/nuxt/dist/head/runtime/components")['NoScript']>
export const LazyLink: LazyComponent<typeof import("../node_modules/nuxt/dist/head/runtime/components")['Link']>
export const LazyBase: LazyComponent<typeof import("../node_modules/nuxt/dist/head/runtime/components")['Base']>
export const LazyTitle: LazyComponent<typeof import("../node_modules/nuxt/dist/head/runtime/components")['Title']>
export const LazyMeta: LazyComponent<typeof import("../node_modules/nuxt/dist/head/runtime/components")['Meta']>
export const LazyStyle: LazyComponent<typeof import("../node_modules/nuxt/dist/head/runtime/components")['Style']>
export const LazyHead: LazyComponent<typeof import("../node_modules/nuxt/dist/head/runtime/components")['Head']>
export const LazyHtml: LazyComponent<typeof import("../node_modules/nuxt/dist/head/runtime/components")['Html']>
export const LazyBody: LazyComponent<typeof import("../node_modules/nuxt/dist/head/runtime/components")['Body']>
export const LazyNuxtIsland: LazyComponent<typeof import("../node_modules/nuxt/dist/app/components/nuxt-island")['default']>

export const componentNames: string[]


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

interface _GlobalComponents {
  FormField: typeof import("../../app/components/FormField.vue")['default']
  BomLinesTable: typeof import("../../app/components/bom/BomLinesTable.vue")['default']
  BomStatusBadge: typeof import("../../app/components/bom/BomStatusBadge.vue")['default']
  ApprovalBadge: typeof import("../../app/components/catalog/ApprovalBadge.vue")['default']
  CatalogPagination: typeof import("../../app/components/catalog/CatalogPagination.vue")['default']
  ImportMapping: typeof import("../../app/components/catalog/ImportMapping.vue")['default']
  ImportPreview: typeof import("../../app/components/catalog/ImportPreview.vue")['default']
  ImportProblems: typeof import("../../app/components/catalog/ImportProblems.vue")['default']
  ImportUpload: typeof import("../../app/components/catalog/ImportUpload.vue")['default']
  ImportWorkspace: typeof import("../../app/components/catalog/ImportWorkspace.vue")['default']
  LifecycleBadge: typeof import("../../app/components/catalog/LifecycleBadge.vue")['default']
  PartEditForm: typeof import("../../app/components/catalog/PartEditForm.vue")['default']
  PartFieldGroups: typeof import("../../app/components/catalog/PartFieldGroups.vue")['default']
  PartVersionHistory: typeof import("../../app/components/catalog/PartVersionHistory.vue")['default']
  PartsTable: typeof import("../../app/components/catalog/PartsTable.vue")['default']
  DesignWorkspace: typeof import("../../app/components/design/DesignWorkspace.vue")['default']
  ConverterFields: typeof import("../../app/components/design/form/ConverterFields.vue")['default']
  DeratingFields: typeof import("../../app/components/design/form/DeratingFields.vue")['default']
  DesignForm: typeof import("../../app/components/design/form/DesignForm.vue")['default']
  OperatingPointsEditor: typeof import("../../app/components/design/form/OperatingPointsEditor.vue")['default']
  QuantityInput: typeof import("../../app/components/design/form/QuantityInput.vue")['default']
  TopologyIcon: typeof import("../../app/components/design/form/TopologyIcon.vue")['default']
  TopologyPicker: typeof import("../../app/components/design/form/TopologyPicker.vue")['default']
  LegSchematic: typeof import("../../app/components/design/results/LegSchematic.vue")['default']
  ProvenanceHint: typeof import("../../app/components/design/results/ProvenanceHint.vue")['default']
  ResultsCapacitorTable: typeof import("../../app/components/design/results/ResultsCapacitorTable.vue")['default']
  ResultsCounts: typeof import("../../app/components/design/results/ResultsCounts.vue")['default']
  ResultsDeviceTable: typeof import("../../app/components/design/results/ResultsDeviceTable.vue")['default']
  ResultsPanel: typeof import("../../app/components/design/results/ResultsPanel.vue")['default']
  ResultsWarnings: typeof import("../../app/components/design/results/ResultsWarnings.vue")['default']
  SpectrumChart: typeof import("../../app/components/design/results/SpectrumChart.vue")['default']
  WaveformChart: typeof import("../../app/components/design/results/WaveformChart.vue")['default']
  TradeStudyChart: typeof import("../../app/components/trade/TradeStudyChart.vue")['default']
  DataTable: typeof import("../../app/components/ui/DataTable.vue")['default']
  AuthState: typeof import("../../node_modules/nuxt-auth-utils/dist/runtime/app/components/AuthState.vue")['default']
  NuxtWelcome: typeof import("../../node_modules/nuxt/dist/app/components/welcome.vue")['default']
  NuxtLayout: typeof import("../../node_modules/nuxt/dist/app/components/nuxt-layout")['default']
  NuxtErrorBoundary: typeof import("../../node_modules/nuxt/dist/app/components/nuxt-error-boundary.vue")['default']
  ClientOnly: typeof import("../../node_modules/nuxt/dist/app/components/client-only")['default']
  DevOnly: typeof import("../../node_modules/nuxt/dist/app/components/dev-only")['default']
  ServerPlaceholder: typeof import("../../node_modules/nuxt/dist/app/components/server-placeholder")['default']
  NuxtLink: typeof import("../../node_modules/nuxt/dist/app/components/nuxt-link")['default']
  NuxtLoadingIndicator: typeof import("../../node_modules/nuxt/dist/app/components/nuxt-loading-indicator")['default']
  NuxtTime: typeof import("../../node_modules/nuxt/dist/app/components/nuxt-time.vue")['default']
  NuxtRouteAnnouncer: typeof import("../../node_modules/nuxt/dist/app/components/nuxt-route-announcer")['default']
  NuxtAnnouncer: typeof import("../../node_modules/nuxt/dist/app/components/nuxt-announcer")['default']
  NuxtImg: typeof import("../../node_modules/nuxt/dist/app/components/nuxt-stubs")['NuxtImg']
  NuxtPicture: typeof import("../../node_modules/nuxt/dist/app/components/nuxt-stubs")['NuxtPicture']
  NuxtPage: typeof import("../../node_modules/nuxt/dist/pages/runtime/page")['default']
  NoScript: typeof import("../../node_modules/nuxt/dist/head/runtime/components")['NoScript']
  Link: typeof import("../../node_modules/nuxt/dist/head/runtime/components")['Link']
  Base: typeof import("../../node_modules/nuxt/dist/head/runtime/components")['Base']
  Title: typeof import("../../node_modules/nuxt/dist/head/runtime/components")['Title']
  Meta: typeof import("../../node_modules/nuxt/dist/head/runtime/components")['Meta']
  Style: typeof import("../../node_modules/nuxt/dist/head/runtime/components")['Style']
  Head: typeof import("../../node_modules/nuxt/dist/head/runtime/components")['Head']
  Html: typeof import("../../node_modules/nuxt/dist/head/runtime/components")['Html']
  Body: typeof import("../../node_modules/nuxt/dist/head/runtime/components")['Body']
  NuxtIsland: typeof import("../../node_modules/nuxt/dist/app/components/nuxt-island")['default']
  LazyFormField: LazyComponent<typeof import("../../app/components/FormField.vue")['default']>
  LazyBomLinesTable: LazyComponent<typeof import("../../app/components/bom/BomLinesTable.vue")['default']>
  LazyBomStatusBadge: LazyComponent<typeof import("../../app/components/bom/BomStatusBadge.vue")['default']>
  LazyApprovalBadge: LazyComponent<typeof import("../../app/components/catalog/ApprovalBadge.vue")['default']>
  LazyCatalogPagination: LazyComponent<typeof import("../../app/components/catalog/CatalogPagination.vue")['default']>
  LazyImportMapping: LazyComponent<typeof import("../../app/components/catalog/ImportMapping.vue")['default']>
  LazyImportPreview: LazyComponent<typeof import("../../app/components/catalog/ImportPreview.vue")['default']>
  LazyImportProblems: LazyComponent<typeof import("../../app/components/catalog/ImportProblems.vue")['default']>
  LazyImportUpload: LazyComponent<typeof import("../../app/components/catalog/ImportUpload.vue")['default']>
  LazyImportWorkspace: LazyComponent<typeof import("../../app/components/catalog/ImportWorkspace.vue")['default']>
  LazyLifecycleBadge: LazyComponent<typeof import("../../app/components/catalog/LifecycleBadge.vue")['default']>
  LazyPartEditForm: LazyComponent<typeof import("../../app/components/catalog/PartEditForm.vue")['default']>
  LazyPartFieldGroups: LazyComponent<typeof import("../../app/components/catalog/PartFieldGroups.vue")['default']>
  LazyPartVersionHistory: LazyComponent<typeof import("../../app/components/catalog/PartVersionHistory.vue")['default']>
  LazyPartsTable: LazyComponent<typeof import("../../app/components/catalog/PartsTable.vue")['default']>
  LazyDesignWorkspace: LazyComponent<typeof import("../../app/components/design/DesignWorkspace.vue")['default']>
  LazyConverterFields: LazyComponent<typeof import("../../app/components/design/form/ConverterFields.vue")['default']>
  LazyDeratingFields: LazyComponent<typeof import("../../app/components/design/form/DeratingFields.vue")['default']>
  LazyDesignForm: LazyComponent<typeof import("../../app/components/design/form/DesignForm.vue")['default']>
  LazyOperatingPointsEditor: LazyComponent<typeof import("../../app/components/design/form/OperatingPointsEditor.vue")['default']>
  LazyQuantityInput: LazyComponent<typeof import("../../app/components/design/form/QuantityInput.vue")['default']>
  LazyTopologyIcon: LazyComponent<typeof import("../../app/components/design/form/TopologyIcon.vue")['default']>
  LazyTopologyPicker: LazyComponent<typeof import("../../app/components/design/form/TopologyPicker.vue")['default']>
  LazyLegSchematic: LazyComponent<typeof import("../../app/components/design/results/LegSchematic.vue")['default']>
  LazyProvenanceHint: LazyComponent<typeof import("../../app/components/design/results/ProvenanceHint.vue")['default']>
  LazyResultsCapacitorTable: LazyComponent<typeof import("../../app/components/design/results/ResultsCapacitorTable.vue")['default']>
  LazyResultsCounts: LazyComponent<typeof import("../../app/components/design/results/ResultsCounts.vue")['default']>
  LazyResultsDeviceTable: LazyComponent<typeof import("../../app/components/design/results/ResultsDeviceTable.vue")['default']>
  LazyResultsPanel: LazyComponent<typeof import("../../app/components/design/results/ResultsPanel.vue")['default']>
  LazyResultsWarnings: LazyComponent<typeof import("../../app/components/design/results/ResultsWarnings.vue")['default']>
  LazySpectrumChart: LazyComponent<typeof import("../../app/components/design/results/SpectrumChart.vue")['default']>
  LazyWaveformChart: LazyComponent<typeof import("../../app/components/design/results/WaveformChart.vue")['default']>
  LazyTradeStudyChart: LazyComponent<typeof import("../../app/components/trade/TradeStudyChart.vue")['default']>
  LazyDataTable: LazyComponent<typeof import("../../app/components/ui/DataTable.vue")['default']>
  LazyAuthState: LazyComponent<typeof import("../../node_modules/nuxt-auth-utils/dist/runtime/app/components/AuthState.vue")['default']>
  LazyNuxtWelcome: LazyComponent<typeof import("../../node_modules/nuxt/dist/app/components/welcome.vue")['default']>
  LazyNuxtLayout: LazyComponent<typeof import("../../node_modules/nuxt/dist/app/components/nuxt-layout")['default']>
  LazyNuxtErrorBoundary: LazyComponent<typeof import("../../node_modules/nuxt/dist/app/components/nuxt-error-boundary.vue")['default']>
  LazyClientOnly: LazyComponent<typeof import("../../node_modules/nuxt/dist/app/components/client-only")['default']>
  LazyDevOnly: LazyComponent<typeof import("../../node_modules/nuxt/dist/app/components/dev-only")['default']>
  LazyServerPlaceholder: LazyComponent<typeof import("../../node_modules/nuxt/dist/app/components/server-placeholder")['default']>
  LazyNuxtLink: LazyComponent<typeof import("../../node_modules/nuxt/dist/app/components/nuxt-link")['default']>
  LazyNuxtLoadingIndicator: LazyComponent<typeof import("../../node_modules/nuxt/dist/app/components/nuxt-loading-indicator")['default']>
  LazyNuxtTime: LazyComponent<typeof import("../../node_modules/nuxt/dist/app/components/nuxt-time.vue")['default']>
  LazyNuxtRouteAnnouncer: LazyComponent<typeof import("../../node_modules/nuxt/dist/app/components/nuxt-route-announcer")['default']>
  LazyNuxtAnnouncer: LazyComponent<typeof import("../../node_modules/nuxt/dist/app/components/nuxt-announcer")['default']>
  LazyNuxtImg: LazyComponent<typeof import("../../node_modules/nuxt/dist/app/components/nuxt-stubs")['NuxtImg']>
  LazyNuxtPicture: LazyComponent<typeof import("../../node_modules/nuxt/dist/app/components/nuxt-stubs")['NuxtPicture']>
  LazyNuxtPage: LazyComponent<typeof import("../../node_modules/nuxt/dist/pages/runtime/page")['default']>
  LazyNoScript: LazyComponent<typeof import("../../node_modules/nuxt/dist/head/runtime/components")['NoScript']>
  LazyLink: LazyComponent<typeof import("../../node_modules/nuxt/dist/head/runtime/components")['Link']>
  LazyBase: LazyComponent<typeof import("../../node_modules/nuxt/dist/head/runtime/components")['Base']>
  LazyTitle: LazyComponent<typeof import("../../node_modules/nuxt/dist/head/runtime/components")['Title']>
  LazyMeta: LazyComponent<typeof import("../../node_modules/nuxt/dist/head/runtime/components")['Meta']>
  LazyStyle: LazyComponent<typeof import("../../node_modules/nuxt/dist/head/runtime/components")['Style']>
  LazyHead: LazyComponent<typeof import("../../node_modules/nuxt/dist/head/runtime/components")['Head']>
  LazyHtml: LazyComponent<typeof import("../../node_modules/nuxt/dist/head/runtime/components")['Html']>
  LazyBody: LazyComponent<typeof import("../../node_modules/nuxt/dist/head/runtime/components")['Body']>
  LazyNuxtIsland: LazyComponent<typeof import("../../node_modules/nuxt/dist/app/components/nuxt-island")['default']>
}

declare module 'vue' {
  export interface GlobalComponents extends _GlobalComponents { }
}

export {}

# transit-parallax: mensajes (sheet) en español. REVISIÓN PENDIENTE: necesita la revisión de un hablante nativo (translations want a native speaker's review).

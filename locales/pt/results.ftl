# transit-parallax: mensagens (results) em português. REVISÃO PENDENTE: precisa da revisão de um falante nativo (translations want a native speaker's review).

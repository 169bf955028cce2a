graph [
  node [
    id 0
    label "s"
    x 0.0
    y 0.0
  ]
  node [
    id 1
    label "a"
    x 100.0
    y -60.0
  ]
  node [
    id 2
    label "b"
    x 100.0
    y 60.0
  ]
  node [
    id 3
    label "t"
    x 200.0
    y 0.0
  ]
  edge [
    source 0
    target 1
    weight 1.0
  ]
  edge [
    source 0
    target 2
    weight 2.0
  ]
  edge [
    source 1
    target 2
    weight 1.0
  ]
  edge [
    source 1
    target 3
    weight 2.0
  ]
  edge [
    source 2
    target 3
    weight 1.0
  ]
]
